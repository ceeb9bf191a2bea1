"""``python -m clampstack``: the command line."""

from clampstack.cli import main

if __name__ == "__main__":
    main(prog_name="clampstack")
