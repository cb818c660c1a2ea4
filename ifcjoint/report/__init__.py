"""Renderers of one results dictionary: JSON, CSV, issue list, BCF, HTML, Markdown, psets.

``results.build_results(model_check)`` (or ``scan.build_scan(scan_result)``) makes the one
dictionary; every file renderer has the signature ``write_x(results, path, **options)`` and
returns counts of what it wrote. Words come from ``words``, from codes; display units are
made here and nowhere else.
"""
