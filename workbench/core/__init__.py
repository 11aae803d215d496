"""The Qt-free scheduling core; also Slackline's Python API.

>>> from workbench.core import Plan, Activity, Link, analyze
"""

from .analysis import Analysis, analyze, moments
from .calendar import WorkCalendar, public_holidays
from .cpm import Analyzer, Schedule
from .errors import CycleError, PlanError
from .model import (DISTRIBUTIONS, LINK_TYPES, Activity, Calendar, CorrelationGroup, Link, Plan,
                    Availability, Resource, Risk, Settings, SignOff)
from .network import Network, compile_network, compile_plan
from .pert import PertOdds

__all__ = [
    "Activity", "Analysis", "Availability", "Resource", "Analyzer", "Calendar", "CorrelationGroup", "CycleError", "DISTRIBUTIONS",
    "LINK_TYPES", "Link", "Network", "PertOdds", "Plan", "PlanError", "Risk", "Schedule", "Settings",
    "SignOff", "WorkCalendar", "analyze", "compile_network", "compile_plan", "moments", "public_holidays",
]
