"""Catalogs of standard parts and materials; every row names its source."""
