"""Tables people edit: the demands CSV."""
