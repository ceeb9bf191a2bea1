"""Lubricants and coatings (thread and bearing-face friction ranges) and torque tools.

Data: ``friction.csv`` (friction ranges per combination, VDI 2230-1 Table A5 friction
classes and common practice, each row with its source) and ``tools.csv`` (the torque
tolerance of a tool class: ISO 6789-1 for hand torque tools, common practice for powered
tools).  A joint or flange file picks one with ``[tightening] lubricant = "..."`` or
``tool = "..."``.
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import cache

from clampstack.catalog._common import by_key, read_csv


@dataclass(frozen=True)
class Lubricant:
    """Friction of a lubricant or coating: thread and head (bearing face) ranges [-]."""

    key: str
    name: str
    thread: tuple[float, float]
    head: tuple[float, float]
    source: str


@dataclass(frozen=True)
class Tool:
    """A torque tool class and its torque tolerance (+-, a fraction)."""

    key: str
    name: str
    tolerance: float
    source: str


@cache
def _lubricants() -> tuple[Lubricant, ...]:
    return tuple(
        Lubricant(
            r["key"],
            r["name"],
            (float(r["thread_min"]), float(r["thread_max"])),
            (float(r["head_min"]), float(r["head_max"])),
            r["source"],
        )
        for r in read_csv("friction.csv")
    )


@cache
def _tools() -> tuple[Tool, ...]:
    return tuple(
        Tool(r["key"], r["name"], float(r["tolerance"]), r["source"]) for r in read_csv("tools.csv")
    )


def lubricants() -> list[Lubricant]:
    """Every lubricant and coating of the catalog."""
    return list(_lubricants())


def tools() -> list[Tool]:
    """Every torque tool class of the catalog."""
    return list(_tools())


def lubricant(key: str) -> Lubricant:
    """The lubricant or coating ``key`` (case and punctuation ignored); InputError with near
    matches if unknown."""
    return by_key(_lubricants(), key, "lubricant", "list them with `clampstack catalog friction`")


def tool(key: str) -> Tool:
    """The torque tool class ``key``; InputError with near matches if unknown."""
    return by_key(_tools(), key, "torque tool", "list them with `clampstack catalog tools`")


def friction_listing() -> tuple[list[str], list[list[str]]]:
    """Display table of the lubricants and coatings."""
    header = ["lubricant", "description", "thread friction [-]", "head friction [-]", "source"]
    rows = [
        [
            x.key,
            x.name,
            f"{x.thread[0]:.2f}..{x.thread[1]:.2f}",
            f"{x.head[0]:.2f}..{x.head[1]:.2f}",
            x.source,
        ]
        for x in _lubricants()
    ]
    return header, rows


def tool_listing() -> tuple[list[str], list[list[str]]]:
    """Display table of the torque tool classes."""
    header = ["tool", "description", "torque tolerance [%]", "source"]
    rows = [[x.key, x.name, f"+-{x.tolerance * 100:g}", x.source] for x in _tools()]
    return header, rows
