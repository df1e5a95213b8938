"""Shared set-up of the LibreOffice integration tests: one soffice per test
module, with the .oxt named by TALLYRATES_OXT installed into a throwaway
profile. Counts go into columns A and B; formulas are typed as a user types
them (display names, ';' separators)."""
import csv
import os
import sys
import unittest

HERE = os.path.dirname(os.path.abspath(__file__))
sys.path.insert(0, HERE)
import lo_session as lo  # noqa: E402

# The families' reference tables (tests/reference/<family>.py writes each).
REFERENCES = [os.path.join(HERE, "..", "reference", name + ".csv") for name in ("omnibus", "pairs", "bayes", "planning", "apart")]
OFFICE = None


def start():
    global OFFICE
    OFFICE = lo.Office(os.environ["TALLYRATES_OXT"]).install().start()
    return OFFICE


def stop():
    if OFFICE is not None:
        OFFICE.stop()


def reference_rows():
    """Rows of the families' reference tables (scipy, statsmodels, mpmath, brute force)."""
    for path in REFERENCES:
        with open(path) as f:
            for row in csv.DictReader(f):
                row["successes"] = [int(v) for v in row["successes"].split()]
                row["attempts"] = [int(v) for v in row["attempts"].split()]
                row["value"] = float(row["value"])
                yield row


class SheetCase(unittest.TestCase):
    def setUp(self):
        self.doc = OFFICE.new_sheet()
        self.sheet = self.doc.Sheets.getByIndex(0)

    def tearDown(self):
        self.doc.close(True)

    def put_counts(self, successes, attempts, col_s="A", col_n="B", first_row=1):
        """None leaves a cell blank; a str is typed as text."""
        for k, (x, n) in enumerate(zip(successes, attempts)):
            for col, v in ((col_s, x), (col_n, n)):
                cell = self.sheet.getCellRangeByName("%s%d" % (col, first_row + k))
                if v is None:
                    cell.setString("")
                elif isinstance(v, str):
                    cell.setString(v)
                else:
                    cell.setValue(v)
        last = first_row + len(successes) - 1
        return "%s%d:%s%d;%s%d:%s%d" % (col_s, first_row, col_s, last, col_n, first_row, col_n, last)

    def open_sample_workbook(self, name):
        """A work copy of the sample workbook, opened in place of the blank sheet."""
        import shutil
        path = os.path.join(OFFICE.workdir, name)
        shutil.copy(os.path.join(HERE, "..", "..", "sample-sheets", "reflow-oven-trial.fods"), path)
        os.chmod(path, 0o644)
        self.doc.close(True)
        self.doc = OFFICE.load(path)

    def formula(self, address, text):
        cell = self.sheet.getCellRangeByName(address)
        cell.setFormula(text)
        return cell

    def value_of(self, address):
        self.doc.calculateAll()
        cell = self.sheet.getCellRangeByName(address)
        self.assertEqual(cell.getError(), 0, "%s shows Err:%d" % (cell.getFormula(), cell.getError()))
        return cell.getValue()

    def shown(self, address):
        self.doc.calculateAll()
        return lo.cell_text(self.sheet.getCellRangeByName(address))

    def assertRelative(self, got, want, tol, what=""):
        if want == 0:
            self.assertLessEqual(abs(got), 1e-300, what)
        else:
            self.assertLessEqual(abs(got - want), tol * abs(want), "%s: got %r want %r" % (what, got, want))


def main():
    start()
    try:
        prog = unittest.main(module="__main__", exit=False, verbosity=2)
    finally:
        stop()
    r = prog.result
    failed = len(r.failures) + len(r.errors)
    print("%d passed, %d failed" % (r.testsRun - failed, failed))
    # pyuno clients may crash at exit (addin-recipe.md): leave at once.
    sys.stdout.flush()  # os._exit skips the flush of piped output
    os._exit(0 if failed == 0 and r.testsRun > 0 else 1)
