"""Files: the ``.slw`` plan file (:mod:`.planfile`) and CSV/XLSX activity tables
(:mod:`.tabular`). No Qt here; an import is all or nothing. See docs/file-format.md."""
