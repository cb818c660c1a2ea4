"""``python -m ifcjoint``: the command line (how a batch runs each model in its own process)."""

from ifcjoint.cli import main

if __name__ == "__main__":
    main()
