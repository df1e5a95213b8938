"""A real headless LibreOffice for tests and for the sample-sheet run.

Starts soffice on 127.0.0.1 on a free port with a throwaway profile, installs
the .oxt into that profile with unopkg first, and connects through Debian's
python3-uno. unopkg refuses a per-user install as root (addin-recipe.md), so
as root it runs as the unprivileged user nobody (uid 65534) on a profile that
user owns. Never runs unopkg while soffice uses the profile.
"""
import os
import shutil
import socket
import subprocess
import tempfile
import time

import uno  # Debian's python3-uno: run under /usr/bin/python3
from com.sun.star.beans import PropertyValue

PROGRAM = "/usr/lib/libreoffice/program"


def _free_port():
    with socket.socket() as s:
        s.bind(("127.0.0.1", 0))
        return s.getsockname()[1]


def _as_profile_owner(cmd, profile):
    """Runs cmd as the profile's owner (nobody when we are root)."""
    env = dict(os.environ, HOME=profile)
    if os.geteuid() == 0:
        cmd = ["setpriv", "--reuid=65534", "--regid=65534", "--clear-groups"] + cmd
    # The caller's folder may be closed to that user (/root is mode 700 on a
    # fresh Debian): run from the profile's own folder.
    return subprocess.run(cmd, env=env, capture_output=True, text=True, timeout=300, cwd=profile)


def prop(name, value):
    p = PropertyValue()
    p.Name, p.Value = name, value
    return p


def file_url(path):
    return uno.systemPathToFileUrl(os.path.abspath(path))


class Office:
    """soffice with the extension installed from `oxt` into a fresh profile."""

    def __init__(self, oxt, workdir=None):
        self.workdir = workdir or tempfile.mkdtemp(prefix="tallyrates-office-")
        self.profile = os.path.join(self.workdir, "profile")
        os.makedirs(self.profile, exist_ok=True)
        if os.geteuid() == 0:
            for d in (self.workdir, self.profile):
                os.chown(d, 65534, 65534)
        # The package is read by the unprivileged user: copy it somewhere it can read.
        self.oxt = os.path.join(self.workdir, os.path.basename(oxt))
        shutil.copy(oxt, self.oxt)
        os.chmod(self.oxt, 0o644)
        self.proc = None
        self.desktop = None

    def install(self):
        """The extension installed into the fresh profile."""
        self._first_start()
        r = _as_profile_owner([PROGRAM + "/unopkg", "add", "-s", "-f",
                               "-env:UserInstallation=" + file_url(self.profile), self.oxt], self.profile)
        if r.returncode != 0:
            raise RuntimeError("unopkg add failed: " + r.stdout + r.stderr)
        self._recalculate_on_load()
        return self

    def without_extension(self):
        """A fresh profile with nothing added: a colleague's LibreOffice."""
        self._first_start()
        self._recalculate_on_load()
        return self

    def _first_start(self):
        # A profile made by unopkg alone loses the registration at soffice's
        # first start (its first-start set-up redoes the extension layer):
        # let soffice create the profile first, then add the package.
        self.start()
        self.stop()

    def _recalculate_on_load(self):
        # Recalculate saved files on load (0 = always), so reloaded workbooks are
        # computed by the extension, not shown from cached values.
        reg = os.path.join(self.profile, "user", "registrymodifications.xcu")
        with open(reg) as f:
            text = f.read()
        item = ('<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="ODFRecalcMode" '
                'oor:op="fuse"><value>0</value></prop></item>\n'
                '<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="OOXMLRecalcMode" '
                'oor:op="fuse"><value>0</value></prop></item>\n')
        text = text.replace("</oor:items>", item + "</oor:items>")
        with open(reg, "w") as f:
            f.write(text)

    def start(self, timeout=90):
        self.port = _free_port()
        self.log = open(os.path.join(self.workdir, "soffice.log"), "w")
        # soffice runs as the profile's owner too: a root soffice on a profile
        # that unopkg filled as nobody does not see the extension registered.
        pre = ["setpriv", "--reuid=65534", "--regid=65534", "--clear-groups"] if os.geteuid() == 0 else []
        self.proc = subprocess.Popen(
            pre + [PROGRAM + "/soffice", "--headless", "--invisible", "--norestore", "--nologo", "--nodefault",
             "--nolockcheck", "-env:UserInstallation=" + file_url(self.profile),
             "--accept=socket,host=127.0.0.1,port=%d;urp;StarOffice.ComponentContext" % self.port],
            stdout=self.log, stderr=subprocess.STDOUT, env=dict(os.environ, HOME=self.profile), cwd=self.workdir)
        local = uno.getComponentContext()
        resolver = local.ServiceManager.createInstanceWithContext("com.sun.star.bridge.UnoUrlResolver", local)
        deadline = time.time() + timeout
        while True:
            try:
                self.ctx = resolver.resolve(
                    "uno:socket,host=127.0.0.1,port=%d;urp;StarOffice.ComponentContext" % self.port)
                break
            except Exception:
                if self.proc.poll() is not None or time.time() > deadline:
                    raise RuntimeError("soffice did not start (see %s)" % self.log.name)
                time.sleep(0.3)
        self.smgr = self.ctx.ServiceManager
        self.desktop = self.smgr.createInstanceWithContext("com.sun.star.frame.Desktop", self.ctx)
        return self

    def alive(self):
        return self.proc is not None and self.proc.poll() is None

    def resident_kb(self):
        """Resident memory of the office process itself (soffice.bin, started
        by the soffice script for this profile), from /proc."""
        marker = "UserInstallation=" + file_url(self.profile)
        for pid in os.listdir("/proc"):
            if not pid.isdigit():
                continue
            try:
                with open("/proc/%s/cmdline" % pid, "rb") as f:
                    cmd = f.read().decode(errors="replace")
                if "soffice.bin" not in cmd or marker not in cmd:
                    continue
                with open("/proc/%s/status" % pid) as f:
                    for line in f:
                        if line.startswith("VmRSS:"):
                            return int(line.split()[1])
            except OSError:
                continue
        return None

    def new_sheet(self):
        return self.desktop.loadComponentFromURL("private:factory/scalc", "_blank", 0, (prop("Hidden", True),))

    def load(self, path):
        return self.desktop.loadComponentFromURL(file_url(path), "_blank", 0, (prop("Hidden", True),))

    def stop(self):
        if self.desktop is not None:
            try:
                self.desktop.terminate()
            except Exception:
                pass  # the bridge goes down with the office
        if self.proc is not None:
            try:
                self.proc.wait(timeout=30)
            except subprocess.TimeoutExpired:
                self.proc.kill()
                self.proc.wait()
        self.desktop = None
        if getattr(self, "log", None) is not None:
            self.log.close()
            self.log = None


def save_as(doc, path, filter_name):
    doc.storeToURL(file_url(path), (prop("FilterName", filter_name),))


def cell_text(cell):
    """What the cell shows: its error code as Err:NNN, else its string."""
    err = cell.getError()
    if err:
        return "Err:%d" % err
    return cell.getString()
