"""The self-test's check of the analysis process (commands/selftest_process.py): the same
series give the same results in the child, and a difference, a failing child or a child that
never answers each give one problem line naming it."""

from __future__ import annotations

import numpy as np

from tauscope.commands.selftest_process import process_problems
from tauscope.engine import Settings, analyse_series


def walks(count: int, length: int = 96) -> list[tuple[str, np.ndarray]]:
    rng = np.random.default_rng(5)
    return [(f"walk {i}", np.cumsum(rng.normal(size=length))) for i in range(count)]


def test_the_same_series_give_no_problem() -> None:
    pairs = walks(2)
    here = [analyse_series(values, name=name) for name, values in pairs]
    assert process_problems(pairs, here, Settings()) == []


def test_a_result_that_differs_is_named() -> None:
    pairs = walks(2)
    here = [analyse_series(values, name=name) for name, values in pairs]
    here[1] = analyse_series(pairs[1][1] * 0.5 + np.arange(96.0), name=pairs[1][0])
    problems = process_problems(pairs, here, Settings())
    assert len(problems) == 1
    assert problems[0].startswith("walk 1: the analysis process differs at verdict.")


def test_a_failing_child_is_one_line() -> None:
    pairs = walks(2)
    problems = process_problems(pairs, [], Settings(),
                                engine_name="engine_process_engines:failing")
    assert problems == ["the analysis process failed: ValueError: simulated failure in the child"]


def test_a_child_that_never_answers_is_one_line() -> None:
    problems = process_problems(walks(1), [], Settings(), answer_s=1.0,
                                engine_name="engine_process_engines:silent")
    assert problems == ["the analysis process gave no answer within 1 s"]
