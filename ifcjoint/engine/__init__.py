"""The check: EN 1993-1-8 engines over plain inputs, and the verification against demands.

``end_plate`` and ``welded`` are the engines (input in ``inputs``, result in ``results``);
``verify`` checks a result against each load combination; ``problems`` lists what is wrong
with a joint. Pure Python over dataclasses in N, mm, MPa; no IFC, no words.
"""
