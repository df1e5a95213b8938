#!/usr/bin/python3
"""What the reference generators of every family share: the libraries and
their versions as a row names them, the row writer, and the runner that
writes a family's sections as CSV (two processes, the sections joined in
their fixed order, so the file is the same as in one).

Each family's generator (omnibus.py, pairs.py, bayes.py, planning.py) writes
its own table, with the header case,successes,attempts,quantity,value,source;
tests/engine/<family>/ and tests/office/ read them, and the ctest
"<family>_reference_current" regenerates each and compares it with the
committed copy. Run with Debian's /usr/bin/python3 (python3-scipy,
python3-statsmodels, python3-mpmath).
"""
import csv
import io
import multiprocessing
import sys

import scipy
import statsmodels

SCIPY = "scipy " + scipy.__version__
STATSMODELS = "statsmodels " + statsmodels.__version__


def fmt(v):
    return repr(float(v))


def row(w, name, x, n, quantity, value, source):
    w.writerow([name, " ".join(map(str, x)), " ".join(map(str, n)), quantity, fmt(value), source])


def section_text(name):
    """One section's rows as text, from the running generator's own
    functions. Every section that uses mpmath sets its own precision, so the
    sections can run in any order, in parallel."""
    buf = io.StringIO()
    getattr(sys.modules["__main__"], name)(csv.writer(buf, lineterminator="\n"))
    return buf.getvalue()


def write_sections(sections):
    sys.stdout.write("case,successes,attempts,quantity,value,source\n")
    with multiprocessing.get_context("fork").Pool(2) as pool:
        for text in pool.map(section_text, sections, chunksize=1):
            sys.stdout.write(text)
