#!/usr/bin/python3
"""The package as users install it: the metadata the Extension Manager shows,
and a per-user install and removal with LibreOffice's own unopkg.

- The .oxt names its identifier, version (the project's), display name,
  publisher, licence (accepted by whoever installs it: the user for their own
  profile, the administrator once for a --shared install), icon (present in the package)
  and minimal LibreOffice version (7.4, the SDK it is built against).
- `unopkg add` into a fresh profile registers it; `unopkg list` shows it with
  the project's version; `unopkg remove` takes it out again: `unopkg list`
  no longer names it, a RATES.* formula typed afterwards is unknown to Calc
  while a built-in formula still answers, and once LibreOffice has started
  after the removal the profile keeps no copy of the component.
(Common practice of the extension format, no source beyond LibreOffice's own
description schema; the installation is per user only: a --shared install
writes into the system's LibreOffice and is not part of the test command.)
"""
import os
import re
import sys
import unittest
import zipfile
import xml.etree.ElementTree as ET

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import lo_session as lo  # noqa: E402

OXT = os.environ["TALLYRATES_OXT"]
ROOT = os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "..")
D = "{http://openoffice.org/extensions/description/2006}"
XLINK = "{http://www.w3.org/1999/xlink}"
LO = "{http://libreoffice.org/extensions/description/2011}"


def project_version():
    with open(os.path.join(ROOT, "CMakeLists.txt")) as f:
        return re.search(r"project\(tallyrates VERSION ([0-9.]+)", f.read()).group(1)


class Package(unittest.TestCase):
    def test_metadata_the_extension_manager_shows(self):
        with zipfile.ZipFile(OXT) as z:
            names = set(z.namelist())
            root = ET.fromstring(z.read("description.xml"))
            self.assertEqual(root.find(D + "identifier").get("value"), "org.tallyrates.calc")
            self.assertEqual(root.find(D + "version").get("value"), project_version())
            self.assertIn("tallyrates", root.find(D + "display-name/" + D + "name").text)
            self.assertTrue(root.find(D + "publisher/" + D + "name").text.strip())
            minimal = root.find(D + "dependencies/" + LO + "LibreOffice-minimal-version")
            self.assertEqual(minimal.get("value"), "7.4")
            licence = root.find(D + "registration/" + D + "simple-license")
            # "admin": a --shared install asks once; with "user" every user's
            # first start asked again, and a headless LibreOffice did not start
            # (tests/office/shared_install.py).
            self.assertEqual(licence.get("accept-by"), "admin")
            for path in (licence.find(D + "license-text").get(XLINK + "href"),
                         root.find(D + "extension-description/" + D + "src").get(XLINK + "href"),
                         root.find(D + "icon/" + D + "default").get(XLINK + "href")):
                self.assertIn(path, names)
            icon = z.read(root.find(D + "icon/" + D + "default").get(XLINK + "href"))
            self.assertEqual(icon[:8], b"\x89PNG\r\n\x1a\n")
            description = z.read(root.find(D + "extension-description/" + D + "src").get(XLINK + "href")).decode()
            for family_word in ("share one success rate", "pair", "decision limits", "Bayesian", "planning",
                                "not\nengineering acceptance"):
                self.assertIn(family_word.replace("\n", " "), description.replace("\n", " "))

    def test_install_list_and_remove_per_user(self):
        office = lo.Office(OXT).install()
        env = "-env:UserInstallation=" + lo.file_url(office.profile)
        listed = lo._as_profile_owner([lo.PROGRAM + "/unopkg", "list", env], office.profile)
        self.assertEqual(listed.returncode, 0, listed.stderr)
        self.assertIn("org.tallyrates.calc", listed.stdout)
        self.assertIn("Version: " + project_version(), listed.stdout)
        self.assertRegex(listed.stdout, r"is registered: yes")
        removed = lo._as_profile_owner([lo.PROGRAM + "/unopkg", "remove", env, "org.tallyrates.calc"], office.profile)
        self.assertEqual(removed.returncode, 0, removed.stdout + removed.stderr)
        listed = lo._as_profile_owner([lo.PROGRAM + "/unopkg", "list", env], office.profile)
        self.assertNotIn("org.tallyrates.calc", listed.stdout)
        office.start()
        try:
            doc = office.new_sheet()
            sheet = doc.Sheets.getByIndex(0)
            sheet.getCellRangeByName("A1").setFormula("=RATES.POST.MEAN(B1:B2;C1:C2;1)")
            sheet.getCellRangeByName("A2").setFormula("=SUM(1;2)")
            doc.calculateAll()
            self.assertNotEqual(sheet.getCellRangeByName("A1").getError(), 0)  # unknown name
            self.assertEqual(sheet.getCellRangeByName("A2").getValue(), 3.0)
            doc.close(True)
        finally:
            office.stop()
        # No copy of the component stays in the profile once LibreOffice has
        # started after the removal (it clears removed packages then).
        left = [os.path.join(d, f) for d, _, files in os.walk(office.profile) for f in files
                if f.endswith(".so") and "tallyrates" in f]
        self.assertEqual(left, [])


if __name__ == "__main__":
    result = unittest.main(exit=False, verbosity=2).result
    sys.stdout.flush()
    # Exit at once: the UNO bridge's threads can hold a normal exit.
    os._exit(0 if result.wasSuccessful() else 1)
