"""EN 1993-1-8 formulas (pure functions over floats/numpy; never imports ifcopenshell).

Empty until the check engine lands: nothing here is called by the scanner yet.
"""
