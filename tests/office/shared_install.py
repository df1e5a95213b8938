#!/usr/bin/python3
"""The package installed for every user of a machine (`unopkg add --shared`)
and removed again (`unopkg remove --shared`), with LibreOffice's own unopkg:
after the install a fresh user profile computes RATES.* cells; after the
removal a fresh profile no longer knows them while built-in functions still
answer. (Common practice of the extension format, no source beyond
LibreOffice's own unopkg.)

It writes into the system's LibreOffice, so it runs only as root on a
throwaway machine; tests/office/run-current-libreoffice runs it there, in
LibreOffice 7.4 and in the current LibreOffice.

    /usr/bin/python3 tests/office/shared_install.py build/tallyrates.oxt
"""
import os
import subprocess
import sys

import lo_session as lo

IDENTIFIER = "org.tallyrates.calc"


def unopkg(*args):
    # The administrator accepts the licence at the console (accept-by="admin"
    # in description.xml), once for every user; answered here.
    r = subprocess.run([lo.PROGRAM + "/unopkg", *args], capture_output=True, text=True, input="yes\n" * 4)
    if r.returncode != 0:
        raise SystemExit("unopkg %s failed: %s%s" % (" ".join(args), r.stdout, r.stderr))
    return r.stdout


def cells_in_a_fresh_profile(oxt):
    """A1:A2 and B1:B2 hold 30 of 50 and 25 of 50; C1 RATES.DIFF of the two
    rows, C2 SUM of the attempts. Returns (C1 error, C1 value, C2 value)."""
    office = lo.Office(oxt).without_extension()
    try:
        office.start()
        doc = office.new_sheet()
        sheet = doc.Sheets.getByIndex(0)
        for k, (x, n) in enumerate([(30, 50), (25, 50)]):
            sheet.getCellByPosition(0, k).setValue(x)
            sheet.getCellByPosition(1, k).setValue(n)
        sheet.getCellRangeByName("C1").setFormula("=RATES.DIFF(A1:A2;B1:B2;1;2)")
        sheet.getCellRangeByName("C2").setFormula("=SUM(B1:B2)")
        doc.calculateAll()
        c1, c2 = sheet.getCellRangeByName("C1"), sheet.getCellRangeByName("C2")
        result = (c1.getError(), c1.getValue(), c2.getValue())
        doc.close(True)
        return result
    finally:
        office.stop()


def main():
    if os.geteuid() != 0 or len(sys.argv) != 2:
        raise SystemExit("usage, as root on a throwaway machine: shared_install.py tallyrates.oxt")
    oxt = os.path.abspath(sys.argv[1])
    unopkg("add", "--shared", oxt)
    listed = unopkg("list", "--shared")
    assert IDENTIFIER in listed, listed
    error, value, total = cells_in_a_fresh_profile(oxt)
    # 30/50 - 25/50 = 0.1 (arithmetic); SUM of the attempts 100.
    assert error == 0 and abs(value - 0.1) < 1e-15 and total == 100, (error, value, total)
    print("shared install: listed by unopkg list --shared; a fresh profile computes RATES.DIFF = %g" % value)
    unopkg("remove", "--shared", IDENTIFIER)
    listed = unopkg("list", "--shared")
    assert IDENTIFIER not in listed, listed
    error, value, total = cells_in_a_fresh_profile(oxt)
    assert error != 0 and total == 100, (error, value, total)
    print("shared removal: gone from unopkg list --shared; a fresh profile shows Err:%d for RATES.DIFF, "
          "SUM still %g" % (error, total))
    sys.stdout.flush()
    os._exit(0)


if __name__ == "__main__":
    try:
        main()
    except BaseException as e:  # the UNO bridge can keep a failing process alive: leave at once
        print("shared install check FAILED: %r" % (e,))
        sys.stdout.flush()
        os._exit(1)
