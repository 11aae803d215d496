"""A Timeline drag lands on the plan's resolution: whole working days (or a day's share of
a week), not 32.3 days of pointer noise."""

from hypothesis import given
from hypothesis import strategies as st

from workbench.core import Activity
from workbench.figures.timeline import dragged_estimate


@given(st.floats(0.5, 200.0), st.sampled_from([1.0, 0.2]))
def test_the_dragged_mean_is_a_whole_number_of_steps(length, resolution):
    act = Activity("A", optimistic=3.0, most_likely=5.0, pessimistic=11.0)
    new = act.with_(**dragged_estimate(act, length, resolution=resolution))
    steps = new.mean / resolution
    if new.most_likely > act.optimistic:          # not held at the optimistic value
        assert abs(steps - round(steps)) < 0.02 / resolution + 1e-9


def test_a_fixed_duration_snaps_to_whole_days():
    assert dragged_estimate(Activity("F", duration=4), 32.3, resolution=1.0) == {"duration": 32.0}
    assert dragged_estimate(Activity("F", duration=4), 6.26) == {"duration": 6.3}    # without: tenths
