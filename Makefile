# clampstack developer commands.  Each target creates .venv on first use.
PYTHON ?= python3
VENV   := .venv
BIN    := $(VENV)/bin
STAMP  := $(VENV)/.installed

.PHONY: demo test bench lint format clean

$(STAMP): pyproject.toml
	test -x $(BIN)/python || $(PYTHON) -m venv $(VENV)
	$(BIN)/python -m pip install --quiet --upgrade pip
	$(BIN)/python -m pip install --quiet -e '.[test,dev]'
	touch $(STAMP)

demo: $(STAMP)
	$(BIN)/clampstack demo

test: $(STAMP)
	$(BIN)/python -m pytest

bench: $(STAMP)
	$(BIN)/python bench/run.py

lint: $(STAMP)
	$(BIN)/ruff check src tests bench
	$(BIN)/ruff format --check src tests bench

format: $(STAMP)
	$(BIN)/ruff format src tests bench
	$(BIN)/ruff check --fix src tests bench

clean:
	rm -rf $(VENV) clampstack-demo build *.egg-info src/*.egg-info .pytest_cache
