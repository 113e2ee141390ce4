"""Material lookups and the typical values they carry."""

import pytest

from generators.errors import UserError
from generators.standards.materials import get_material, material_ids


def test_ids():
    assert material_ids() == ["hdpe", "uhmw", "pom", "nylon", "aluminium-6061", "plywood", "pla",
                              "petg", "asa", "fiberglass"]


@pytest.mark.parametrize("alias,id_", [("aluminum-6061", "aluminium-6061"), ("6061", "aluminium-6061"),
                                       ("acetal", "pom"), ("uhmw-pe", "uhmw"), ("nylon-66", "nylon"),
                                       ("birch-plywood", "plywood"), ("HDPE", "hdpe")])
def test_aliases(alias, id_):
    assert get_material(alias).id == id_


def test_6061_t6_values():
    m = get_material("aluminium-6061")  # ASM handbook 6061-T6: 2.70 g/cm3, 310 MPa UTS, 276 MPa yield
    assert (m.density_g_cm3, m.tensile_mpa, m.yield_mpa) == (2.70, 310, 276)
    assert m.material_class == "metal"


def test_every_row_sane_and_sourced():
    for i in material_ids():
        m = get_material(i)
        assert m.source and m.material_class in ("plastic", "wood", "metal", "composite")
        assert 0.5 < m.density_g_cm3 < 3 and 0 < m.bearing_mpa <= m.yield_mpa <= m.tensile_mpa


def test_unknown_material():
    with pytest.raises(UserError) as err:
        get_material("hdpee")
    assert err.value.key == "hub.material" and "'hdpe'" in str(err.value)
