"""Config loading: typed models in mm, one-line errors naming the key."""

import subprocess
import sys
from pathlib import Path

import pytest

from generators.config import load_config, parse_config
from generators.errors import UserError

ROOT = Path(__file__).resolve().parents[2]
BASE = {
    "name": "t", "units": "mm",
    "mast": {"size": "1-1/4 in EMT"},
    "hub": {"across_flats": 160, "thickness": 46},
    "spreaders": {"count": 6, "diameter": 20},
}


def cfg(**sections):
    data = {k: (dict(v) if isinstance(v, dict) else v) for k, v in BASE.items()}
    for k, v in sections.items():
        if isinstance(v, dict) and isinstance(data.get(k), dict):
            data[k].update(v)
        else:
            data[k] = v
    return data


def test_demos_load():
    for path in (ROOT / "configs").glob("*.toml"):
        c = load_config(path)
        assert c.hub.thickness > 0


def test_inch_config_is_converted_to_mm():
    c = parse_config(cfg(units="in", hub={"across_flats": 6, "thickness": "1-1/2 in"},
                         spreaders={"count": 4, "diameter": 0.75}))
    assert c.hub.across_flats == pytest.approx(152.4)
    assert c.hub.thickness == pytest.approx(38.1)
    assert c.spreaders.diameter == pytest.approx(19.05)


def test_mast_designation_resolves():
    c = parse_config(cfg())
    assert c.mast.size.od_mm == pytest.approx(1.510 * 25.4)  # ANSI C80.3: 1-1/4 EMT OD 1.510 in (from memory)


@pytest.mark.parametrize("data, key, words", [
    (cfg(hub={"thicknes": 40}), "hub.thicknes", "did you mean 'thickness'"),
    (cfg(spreaders={"count": 13}), "spreaders.count", "out of range"),
    (cfg(hub={"style": "cube"}), "hub.style", "not accepted"),
    (cfg(units="furlong"), "units", '"mm" or "in"'),
    (cfg(mast={"size": "1 in PVC"}), "mast.size", ""),
    (cfg(set_screws={"thread": "1/4-19"}), "set_screws.thread", "did you mean"),
    (cfg(spreaders={"socket_depth": "deep"}), "spreaders.socket_depth", "to-bore"),
    (cfg(holes=[{"id": "A", "at": [50, 0], "diameter": 5}, {"id": "A", "at": [0, 50], "diameter": 5}]),
     "holes", "used twice"),
    (cfg(holes=[{"id": "A", "at": [50, 0]}]), "holes[0].thread", "exactly one"),
    (cfg(name="../escape"), "name", "output folder"),
    (cfg(mast_pin="M8"), "mast_pin", "a [mast_pin] table with keys thread, height, azimuth"),
    (cfg(holes=["A"]), "holes[0]", "a table with keys id, face, at"),
])
def test_bad_input_is_one_line_naming_the_key(data, key, words):
    with pytest.raises(UserError) as exc:
        parse_config(data)
    line = exc.value.line()
    assert line.startswith(key + ":"), line
    assert words in line
    assert "\n" not in line


def test_cli_bad_input_exits_2_with_one_line(tmp_path):
    bad = tmp_path / "bad.toml"
    bad.write_text('name = "x"\n[mast]\nsise = 3\n')
    out = tmp_path / "out"
    r = subprocess.run([sys.executable, "-m", "generators", "build", str(bad), "--out", str(out)],
                       capture_output=True, text=True)
    assert r.returncode == 2
    assert r.stderr.count("\n") == 1 and r.stderr.startswith("error: mast.sise: unknown key")
    assert "Traceback" not in r.stderr
    assert not out.exists()


def test_malformed_toml_names_the_line(tmp_path):
    bad = tmp_path / "bad.toml"
    bad.write_text('name = "x"\n[mast\nsize = 1\n')
    with pytest.raises(UserError, match="line 2"):
        load_config(bad)


def test_non_utf8(tmp_path):
    bad = tmp_path / "bad.toml"
    bad.write_bytes(b'name = "x\xff"\n')
    with pytest.raises(UserError, match="not UTF-8"):
        load_config(bad)


def test_config_path_is_a_directory(tmp_path):
    with pytest.raises(UserError, match="is a folder"):
        load_config(tmp_path)
