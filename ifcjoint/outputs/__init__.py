"""Renderers of the one result object: text summary, JSON, CSV (later BCF, HTML)."""
