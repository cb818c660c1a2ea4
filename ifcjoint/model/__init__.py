"""Plain data shared by every stage: model elements, joints, demands, typed codes, identities.

Nothing here imports another ifcjoint package: every other layer builds on it.
"""
