"""Input files -> validated specifications (the other end of the flow from ``outputs``).

``files`` loads a TOML file safely, ``schema`` declares and checks the keys of a
table, ``tables`` reads the tables that joint and flange files share, and
``joint``, ``flange`` and ``assembly`` turn a whole file into a
:class:`~clampstack.joint.model.JointSpec`, a
:class:`~clampstack.flange.model.FlangeSpec` or an
:class:`~clampstack.assembly.Assembly`.
"""
