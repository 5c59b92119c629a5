"""DXF and preview output. Renders what the builder resolved; computes no design values."""
