#!/usr/bin/python3
"""Saved workbooks: the stored function names are a file format, and a
workbook saved with our functions must compute again when reopened."""
import os
import unittest
import zipfile

import harness
from harness import SheetCase


class SaveAndReload(SheetCase):
    def test_stored_names_and_values_survive_reload(self):
        r = self.put_counts([45, 171, 12], [50, 190, 12])
        self.formula("D1", '=RATES.SAME.P(%s;"pearson")' % r)
        self.formula("D2", "=RATES.CHECK(%s)" % r)
        self.formula("D3", "=RATES.DIFF(%s;1;2)" % r)
        self.sheet.getCellRangeByName("F1:G11").setArrayFormula("RATES.SAME.REPORT(%s)" % r)
        self.doc.calculateAll()
        before = [self.value_of("D1"), self.shown("D2"), self.value_of("D3")]
        # Inside the office work folder: soffice may run as another user (lo_session.py).
        path = os.path.join(harness.OFFICE.workdir, "tally.ods")
        harness.lo.save_as(self.doc, path, "calc8")
        content = zipfile.ZipFile(path).read("content.xml").decode()
        # The file format promise: SERVICE.METHOD in upper case.
        self.assertIn("of:=ORG.TALLYRATES.SHEET.RATES.SAMEP([.A1:.A3];[.B1:.B3];&quot;pearson&quot;)", content)
        self.assertIn("of:=ORG.TALLYRATES.SHEET.RATES.CHECK(", content)
        self.assertIn("of:=ORG.TALLYRATES.SHEET.RATES.DIFF(", content)
        self.assertIn("of:=ORG.TALLYRATES.SHEET.RATES.SAMEREPORT(", content)
        self.doc.close(True)
        self.doc = harness.OFFICE.load(path)
        self.sheet = self.doc.Sheets.getByIndex(0)
        self.assertEqual(self.sheet.getCellRangeByName("D1").getFormula(),
                         '=ORG.TALLYRATES.SHEET.RATES.SAMEP(A1:A3;B1:B3;"pearson")')
        # scipy 1.10.1 chi2_contingency(correction=False): 0.5152217467702506 (omnibus.csv).
        self.assertRelative(self.value_of("D1"), 0.5152217467702506, 1e-12)
        self.assertEqual([self.value_of("D1"), self.shown("D2"), self.value_of("D3")], before)
        self.assertEqual(self.sheet.getCellRangeByName("F3").getString(), "p-value")
        # Still live after reload.
        self.sheet.getCellRangeByName("A1").setValue(40)
        self.doc.calculateAll()
        self.assertNotEqual(self.value_of("D1"), before[0])


if __name__ == "__main__":
    harness.main()
