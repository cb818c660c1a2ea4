"""What the trade's catalogues say: I sections by designation, steel grades, bolt classes.

Pure Python over bundled data (``ifcjoint/data/sections.csv``); no IFC.
"""
