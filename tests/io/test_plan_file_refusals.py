"""A plan file with hostile content is refused with a message naming the field
(issue 20, items 6, 10 and 14): numbers too large for a float, the same link twice,
risk delays out of range, text a UTF-8 file cannot hold, files over the size limit."""

import datetime as dt
import json

import pytest

from workbench.core import Activity, Link, Plan, Settings
from workbench.core.demo import demo_plan
from workbench.io import planfile
from workbench.io.planfile import PlanFileError, dumps, load_plan, loads, plan_to_dict, save_plan

HUGE = 10 ** 400  # far beyond the largest float


def demo_data() -> dict:
    return plan_to_dict(demo_plan())


def refused(data, *fragments):
    with pytest.raises(PlanFileError) as info:
        loads(json.dumps(data), "kiosk.slw")
    message = str(info.value)
    for fragment in fragments:
        assert fragment in message, message
    return message


@pytest.mark.parametrize("where, field, change", [
    ("activity M0", "duration", lambda d: d["activities"][0].update(duration=HUGE)),
    ("activity M0", "pessimistic", lambda d: d["activities"][0].update(pessimistic=HUGE)),
    ("link M0 \u2192 A1", "lag", lambda d: d["links"][0].update(lag=-HUGE)),
    ("settings", "offset", lambda d: d["settings"].update(deadline={"offset": HUGE})),
    ("settings", "target_confidence", lambda d: d["settings"].update(target_confidence=HUGE)),
    ("correlation group", "coefficient", lambda d: d["correlations"][0].update(coefficient=HUGE)),
    ("risk R1", "probability", lambda d: d["risks"][0].update(probability=HUGE)),
])
def test_integers_too_large_for_a_float_are_refused_naming_the_field(where, field, change):
    data = demo_data()
    change(data)
    refused(data, where, f"'{field}'", "too large")


@pytest.mark.parametrize("version_one", [
    {"deadline": HUGE, "activities": [{"id": "A", "duration": 2}]},
    {"activities": [{"id": "A", "duration": HUGE}]},
    {"activities": [{"id": "A", "estimate": [1, 2, HUGE]}]},
])
def test_version_1_files_with_huge_integers_are_refused(version_one):
    data = {"format": "slackline-workbook", "version": 1, "start": "2027-01-04", **version_one}
    refused(data, "too large")


def test_the_same_link_twice_is_refused_naming_it():
    data = demo_data()
    data["links"].append(dict(data["links"][0]))
    refused(data, "link M0 \u2192 A1 (FS) appears twice", f"links 1 and {len(data['links'])}")


def test_an_ss_and_an_ff_link_between_two_activities_are_two_links():
    data = demo_data()
    pairs = [(l["pred"], l["succ"]) for l in data["links"]]
    assert len(pairs) != len(set(pairs))  # the demo has such a pair (D2 → D3 SS and FF)
    assert len(loads(json.dumps(data)).links) == len(data["links"])


def test_a_risk_delay_beyond_the_plan_range_is_refused_naming_the_risk():
    data = demo_data()
    data["risks"][0].update(pessimistic=1e300)
    refused(data, "risk R1", "'pessimistic'", "beyond 1,000,000 plan units")


@pytest.mark.parametrize("where, change", [
    ("settings: field 'title'", lambda d: d["settings"].update(title="Kiosk \ud800 fit-out")),
    ("activity A2: field 'name'", lambda d: d["activities"][2].update(name="Panel \udc01")),
    ("activity A2: field 'notes'", lambda d: d["activities"][2].update(notes="\ud83d")),
    ("settings: field 'sign_off.role'", lambda d: d["settings"]["sign_off"][0].update(role="Chair \udfff")),
    ("risk R1: field 'name'", lambda d: d["risks"][0].update(name="\udead")),
])
def test_a_lone_surrogate_is_named_not_a_bare_codec_error(where, change):
    data = demo_data()
    change(data)
    message = refused(data, where, "lone surrogate")
    assert "codec" not in message


def test_emoji_and_other_scripts_written_as_surrogate_pairs_still_load():
    data = demo_data()
    data["activities"][2]["name"] = "Handover \U0001F389 \u05de\u05e1\u05d9\u05e8\u05d4"
    text = json.dumps(data)  # ensure_ascii: the emoji is written as a surrogate pair escape
    assert "\\ud83c" in text
    assert loads(text).activities[2].name.startswith("Handover \U0001F389")


def test_a_plan_holding_unstorable_text_is_not_saved_and_the_file_is_untouched(tmp_path):
    path = tmp_path / "kiosk.slw"
    save_plan(demo_plan(), path)
    before = path.read_bytes()
    plan = demo_plan()
    plan.settings.title = "Kiosk \ud800"  # slipped past the edit checks, as a buggy caller might
    with pytest.raises(PlanFileError, match=r"not saved: settings: field 'title' holds .*lone surrogate U\+D800"):
        save_plan(plan, path)
    assert path.read_bytes() == before and sorted(p.name for p in tmp_path.iterdir()) == ["kiosk.slw"]


def size_of_a_million_activity_plan() -> int:
    """Bytes of a 1,000,000-activity plan as Slackline writes it, from 2,000 of its activities."""
    n = 2_000
    acts = [Activity(f"W{i:07d}", f"Work package {i:07d}", optimistic=1.5, most_likely=2.25, pessimistic=4.75)
            for i in range(n)]
    links = [Link(f"W{i - 1:07d}", f"W{i:07d}", "FS", 0.0) for i in range(1, n)]
    plan = Plan(Settings(title="Million", start=dt.date(2027, 1, 4)), acts, links)
    return len(dumps(plan).encode("utf-8")) * (1_000_000 // n)


def test_the_load_limit_admits_a_million_activity_plan():
    assert size_of_a_million_activity_plan() > 256 * 2 ** 20  # larger than the old limit
    assert size_of_a_million_activity_plan() < planfile.MAX_BYTES


def test_a_plan_over_the_limit_is_never_written(tmp_path, monkeypatch):
    monkeypatch.setattr(planfile, "MAX_BYTES", 2_000)
    path = tmp_path / "big.slw"
    with pytest.raises(PlanFileError, match="more than the .* a plan file may hold; split the plan"):
        save_plan(demo_plan(), path)
    assert not path.exists()


def test_what_save_writes_load_reads_at_the_limit(tmp_path, monkeypatch):
    plan = demo_plan()
    size = len(dumps(plan).encode("utf-8"))
    monkeypatch.setattr(planfile, "MAX_BYTES", size)
    save_plan(plan, tmp_path / "edge.slw")
    assert plan_to_dict(load_plan(tmp_path / "edge.slw")) == plan_to_dict(plan)


def test_a_file_over_the_limit_says_what_to_do(tmp_path, monkeypatch):
    path = tmp_path / "huge.slw"
    save_plan(demo_plan(), path)
    monkeypatch.setattr(planfile, "MAX_BYTES", 1_000)
    with pytest.raises(PlanFileError, match="more than the .* limit; Slackline never writes a plan file this large. "
                                            "If it is a plan, split it"):
        load_plan(path)


def test_running_out_of_memory_while_opening_says_what_to_do(tmp_path, monkeypatch):
    path = tmp_path / "kiosk.slw"
    save_plan(demo_plan(), path)

    def no_memory(*args, **kwargs):
        raise MemoryError

    monkeypatch.setattr(planfile, "loads", no_memory)
    with pytest.raises(PlanFileError, match="not enough memory to open .* close other programs"):
        load_plan(path)
