"""hubwright: centre hubs for spreader-type wire beams, from a short TOML file."""

__version__ = "0.1.0"
