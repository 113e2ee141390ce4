"""Configuration: TOML file → validated, frozen models in millimetres and degrees."""

from generators.config.load import load_config, parse_config
from generators.config.models import Config

__all__ = ["Config", "load_config", "parse_config"]
