"""How a result shows itself in a notebook, without the domain knowing the presentation.

The domain packages (joint, flange, assembly, studies) compute results; the
presentation (:mod:`clampstack.outputs`) draws them.  Domain code never imports
the presentation, so the link runs the other way, through this one small
registry at the bottom of the layers:

* a result class derives from :class:`Shown`, which gives it ``_repr_html_``;
* the presentation registers one function per result class with
  ``@html_for(ResultClass)`` (all of them in :mod:`clampstack.outputs.notebook`);
* the package's top level (``clampstack/__init__.py``, which sits above every
  layer) hands this registry the loader of that module, so the first result
  shown in a notebook loads the presentation once.

Without a registered renderer ``_repr_html_`` returns None, and Jupyter falls back
to the plain ``repr``.
"""

from __future__ import annotations

from collections.abc import Callable
from typing import Any

_RENDERERS: dict[type, Callable[[Any], str]] = {}
_LOADER: list[Callable[[], object]] = []


def html_for(cls: type) -> Callable[[Callable[[Any], str]], Callable[[Any], str]]:
    """Register the decorated function as the HTML view of instances of ``cls``."""

    def register(fn: Callable[[Any], str]) -> Callable[[Any], str]:
        _RENDERERS[cls] = fn
        return fn

    return register


def set_loader(loader: Callable[[], object]) -> None:
    """Call ``loader`` (once) before the first lookup that finds no renderer."""
    _LOADER[:] = [loader]


def render_html(obj: object) -> str | None:
    """The registered HTML view of ``obj`` (the nearest class in its MRO), or None."""
    for _attempt in range(2):
        for klass in type(obj).__mro__:
            fn = _RENDERERS.get(klass)
            if fn is not None:
                return fn(obj)
        if not _LOADER:
            return None
        _LOADER.pop()()
    return None


class Shown:
    """Mixin of result classes: ``_repr_html_`` from the registered presentation."""

    __slots__ = ()

    def _repr_html_(self) -> str | None:
        return render_html(self)
