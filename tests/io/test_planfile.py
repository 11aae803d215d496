"""The .slw plan file: round-trip, validation messages, versions, bad files, hash."""

import copy
import datetime as dt
import json
from pathlib import Path

import pytest

from workbench.core import Activity, CycleError, Link, Plan, PlanError, Settings, analyze
from workbench.io.planfile import (FORMAT, VERSION, PlanFileError, dumps, load_plan, loads,
                                   plan_from_dict, plan_hash, plan_to_dict, save_plan)

DATA = Path(__file__).resolve().parents[1] / "data"
V1 = DATA / "harbour_kiosk_v1.slw"
V2 = DATA / "harbour_kiosk_v2.slw"
V3 = DATA / "harbour_kiosk_v3.slw"


@pytest.fixture
def kiosk():
    return load_plan(V3)


@pytest.fixture
def data(kiosk):
    return plan_to_dict(kiosk)


def bad(data, message_parts):
    with pytest.raises(PlanFileError) as info:
        plan_from_dict(data)
    for part in message_parts:
        assert part in str(info.value)
    return info.value


# --- round trip ---------------------------------------------------------------
def test_sample_loads_with_every_field(kiosk):
    s = kiosk.settings
    assert s.title == "Harbour kiosk refit" and s.start == dt.date(2026, 3, 2)
    assert s.calendar.holidays == (dt.date(2026, 4, 3), dt.date(2026, 4, 6))
    assert s.deadline == dt.date(2026, 4, 30) and s.status_date == dt.date(2026, 3, 16)
    assert s.target_confidence == 0.8 and s.distribution == "triangular" and s.revision == "B"
    assert [(p.name, p.role) for p in s.sign_off] == [("R. Okafor", "Harbour master"), ("L. Brandt", "Owner")]
    assert kiosk.activity("STRIP").start_no_earlier == dt.date(2026, 3, 9)
    assert kiosk.activity("FIT").finish_no_later == 24.5
    assert kiosk.activity("PERM").distribution == "beta-pert" and kiosk.activity("PERM").group == "Approvals"
    assert Link("PERM", "ELEC", "SS", 2.0) in kiosk.links
    assert kiosk.risks[0].activities == ("FIT",) and kiosk.correlations[0].coefficient == 0.6


def test_dict_round_trip_is_exact(data):
    assert plan_to_dict(plan_from_dict(data)) == data
    assert plan_from_dict(data) is not None and data["version"] == VERSION and data["format"] == FORMAT


def test_stored_file_text_round_trips_byte_for_byte(kiosk):
    assert dumps(kiosk) == V3.read_text(encoding="utf-8")


def test_version_2_sample_upgrades_to_the_version_3_sample():
    assert dumps(load_plan(V2)) == V3.read_text(encoding="utf-8")


def test_awkward_floats_are_kept_exactly(tmp_path):
    values = (0.1 + 0.2, 1 / 3, 2.0 ** -30, 98765.4321987654321)
    acts = [Activity(f"X{i}", optimistic=v, most_likely=v * 2, pessimistic=v * 3) for i, v in enumerate(values)]
    plan = Plan(Settings(start=dt.date(2026, 1, 5), deadline=1 / 7), acts, [Link("X0", "X1", "FF", -1 / 3)])
    save_plan(plan, tmp_path / "f.slw")
    back = load_plan(tmp_path / "f.slw")
    assert [a.optimistic for a in back.activities] == list(values)
    assert [a.pessimistic for a in back.activities] == [v * 3 for v in values]
    assert back.links[0].lag == -1 / 3 and back.settings.deadline == 1 / 7


def test_offset_and_date_are_told_apart(data):
    data["settings"]["deadline"] = {"offset": 20.0}
    data["activities"][2]["start_no_earlier"] = {"date": "2026-03-10"}
    plan = plan_from_dict(data)
    assert plan.settings.deadline == 20.0 and isinstance(plan.settings.deadline, float)
    assert plan.activity("STRIP").start_no_earlier == dt.date(2026, 3, 10)


def test_loaded_plan_schedules(kiosk):
    result = analyze(kiosk)
    assert result.schedule.finish > 0
    assert result.to_dict()["activities"]["OPEN"]["critical"] in (True, False)


# --- validation messages -----------------------------------------------------
def test_number_field_given_as_text_names_activity_and_field(data):
    data["activities"][3]["pessimistic"] = "ten"
    err = bad(data, ["activity ELEC", "'pessimistic'", "must be a number", '"ten"'])
    assert err.culprit == "activity ELEC"


def test_boolean_is_not_a_number(data):
    data["activities"][0]["duration"] = True
    bad(data, ["activity SURV", "'duration'", "must be a number"])


def test_estimates_out_of_order_use_core_message(data):
    data["activities"][1]["most_likely"] = 20.0
    bad(data, ["activity PERM", "out of order"])


def test_unknown_link_end(data):
    data["links"].append({"pred": "FIT", "succ": "GHOST", "type": "FS", "lag": 0.0})
    bad(data, ["GHOST", "unknown activity"])


def test_unknown_link_type(data):
    data["links"][0]["type"] = "XX"
    bad(data, ["SURV", "PERM", "unknown link type"])


def test_duplicate_ids(data):
    data["activities"].append(copy.deepcopy(data["activities"][1]))
    bad(data, ["activity PERM", "duplicate id", "activities 2 and 7"])


def test_cycle_reports_loop_in_order(data):
    data["links"].append({"pred": "OPEN", "succ": "SURV", "type": "FS", "lag": 0.0})
    err = bad(data, ["the links form a loop"])
    assert isinstance(err.__cause__, CycleError)
    loop = err.__cause__.loop
    assert loop[0] == loop[-1] and {"SURV", "OPEN"} <= set(loop)


def test_bad_date_and_untagged_constraint(data):
    data["settings"]["status_date"] = "16/03/2026"
    bad(data, ["settings", "'status_date'", "YYYY-MM-DD", "16/03/2026"])


def test_untagged_constraint_is_refused(data):
    data["activities"][4]["finish_no_later"] = 24.5
    bad(data, ["activity FIT", "'finish_no_later'", '{"offset": number}'])


def test_unknown_field_is_reported(data):
    data["activities"][0]["pesimistic"] = 3
    bad(data, ["activity SURV", "unknown field 'pesimistic'"])


def test_missing_id(data):
    del data["activities"][2]["id"]
    bad(data, ["activity 3", "'id'", "missing"])


def test_risk_and_correlation_checks(data):
    broken = copy.deepcopy(data)
    broken["risks"][0]["probability"] = 1.5
    bad(broken, ["risk R1", "'probability'", "between 0 and 1"])
    broken = copy.deepcopy(data)
    broken["correlations"][0]["activities"] = ["ELEC", "NOPE"]
    bad(broken, ["correlation group Trades", "NOPE"])


def test_plan_file_error_is_a_plan_error():
    assert issubclass(PlanFileError, PlanError)


# --- versions -------------------------------------------------------------------
def test_newer_version_is_refused_naming_both(data):
    data["version"] = VERSION + 1
    bad(data, [f"version {VERSION + 1}", f"up to {VERSION}", "newer"])


@pytest.mark.parametrize("version", ["2", 2.0, None, True])
def test_version_must_be_whole_number(data, version):
    data["version"] = version
    bad(data, ["'version'", "whole number"])


def test_version_1_file_upgrades(kiosk):
    old = load_plan(V1)
    assert old.ids() == kiosk.ids()
    assert sorted(old.links, key=lambda l: l.key) == sorted(kiosk.links, key=lambda l: l.key)
    assert old.settings.deadline == dt.date(2026, 4, 30)
    assert old.settings.calendar.holidays == kiosk.settings.calendar.holidays
    assert (old.activity("PERM").optimistic, old.activity("PERM").pessimistic) == (5.0, 15.0)
    assert old.activity("ELEC").notes == "needs the permit started"
    assert old.risks == [] and old.correlations == []
    assert analyze(old).schedule.finish > 0


def test_version_1_upgrade_saves_as_current_version(tmp_path):
    save_plan(load_plan(V1), tmp_path / "up.slw")
    assert json.loads((tmp_path / "up.slw").read_text())["version"] == VERSION


def test_version_1_bad_estimate_and_bad_predecessor_text():
    raw = json.loads(V1.read_text())
    raw["activities"][1]["estimate"] = [5, 8]
    bad(raw, ["activity PERM", "'estimate'", "three numbers"])
    raw = json.loads(V1.read_text())
    raw["activities"][3]["after"] = "STRIP; PERM XS 2"
    bad(raw, ["activity ELEC", "unknown link type", "'after'"])


def test_version_1_offset_deadline():
    raw = json.loads(V1.read_text())
    raw["deadline"] = 30
    assert plan_from_dict(raw).settings.deadline == 30.0


# --- bad files --------------------------------------------------------------------
@pytest.mark.parametrize("content, message", [
    (b"", "empty"),
    (b"   \n", "empty"),
    (b"\x89PNG\r\n\x1a\n\x00\x00\x00\rIHDR", "binary"),
    ("{\"format\": \"slackline-workbook\", \"title\": \"Caf\u00e9\"}".encode("cp1252"), "not UTF-8"),
    (b"{\"format\": \"slackline-workbook\", ", "not valid JSON"),
    (b"[1, 2, 3]", "not a Slackline plan file"),
    (b"{\"hello\": 1}", "no 'format' field"),
    (b"{\"format\": \"something-else\", \"version\": 1}", "not a Slackline plan file"),
    (b"{\"format\": \"slackline-workbook\", \"format\": \"x\"}", "appears twice"),
    ("{\"format\": \"slackline-workbook\"}".encode("utf-16"), "UTF-16"),
])
def test_bad_files_raise_plan_file_error(tmp_path, content, message):
    path = tmp_path / "bad.slw"
    path.write_bytes(content)
    with pytest.raises(PlanFileError) as info:
        load_plan(path)
    assert message in str(info.value) and "bad.slw" in str(info.value)


def test_nan_in_file_is_refused(tmp_path, kiosk):
    text = dumps(kiosk).replace('"pessimistic": 4.0', '"pessimistic": NaN', 1)
    with pytest.raises(PlanFileError, match="NaN"):
        loads(text)


def test_missing_file_and_folder(tmp_path):
    with pytest.raises(PlanFileError, match="cannot read"):
        load_plan(tmp_path / "nowhere.slw")
    with pytest.raises(PlanFileError, match="cannot read"):
        load_plan(tmp_path)


def test_utf8_with_bom_is_accepted(tmp_path, kiosk):
    path = tmp_path / "bom.slw"
    path.write_bytes(b"\xef\xbb\xbf" + dumps(kiosk).encode("utf-8"))
    assert plan_to_dict(load_plan(path)) == plan_to_dict(kiosk)


# --- hash ---------------------------------------------------------------------------
def test_hash_is_stable_and_sensitive(kiosk):
    h = plan_hash(kiosk)
    assert len(h) == 12 and int(h, 16) >= 0
    assert plan_hash(load_plan(V2)) == h
    changed = kiosk.copy()
    changed.replace_activity("FIT", changed.activity("FIT").with_(pessimistic=9.5))
    assert plan_hash(changed) != h
    retitled = kiosk.copy()
    retitled.set_settings(Settings(**{**vars(kiosk.settings), "revision": "C"}))
    assert plan_hash(retitled) != h


def test_hash_ignores_key_order(kiosk):
    import hashlib
    canonical = json.dumps(plan_to_dict(kiosk), sort_keys=True, separators=(",", ":"), ensure_ascii=False)
    assert plan_hash(kiosk) == hashlib.sha256(canonical.encode()).hexdigest()[:12]


def test_upgrade_chain_covers_every_older_version():
    from workbench.io.plan_migrate import UPGRADES
    assert sorted(UPGRADES) == list(range(1, VERSION))
