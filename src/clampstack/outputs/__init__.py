"""The presentation of results: readable text, HTML tables, CSV, progress bars, file writing.

Each module renders one kind of result (``joint``, ``flange``, ``sweep``,
``scatter``, ``size``, ``assembly``); ``text`` holds the shared formatting and the
caution, ``html`` the small HTML pages and tables, ``notebook`` the ``_repr_html_``
views, ``files`` the atomic writing. Nothing in the domain imports this package.
"""
