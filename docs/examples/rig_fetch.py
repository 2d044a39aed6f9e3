#!/usr/bin/env python3
"""Fetch an approved Pulseloom schedule on the rig PC, verify it, print its first pulses.

Python standard library only.

  PULSELOOM_URL=http://pulseloom.lab:3000 PULSELOOM_TOKEN=plr_... python3 rig_fetch.py
      lists the rig's approved versions, downloads the first (or --version ID) as CSV
      into --out (default .), and verifies it. A file already there is revalidated
      with If-None-Match: the server answers 304 when it is still the approved one.
  python3 rig_fetch.py --file schedule.csv
      verifies a file already on disk.

Exit status: 0 verified, 1 verification failed, 2 usage or HTTP error.
"""
import argparse
import csv
import hashlib
import io
import json
import os
import re
import sys
import urllib.error
import urllib.request

PREVIEW = "# PREVIEW — NOT APPROVED FOR USE"


def get(url, token, etag=None):
    req = urllib.request.Request(url, headers={"Authorization": f"Bearer {token}"})
    if etag:
        req.add_header("If-None-Match", etag)
    try:
        with urllib.request.urlopen(req, timeout=60) as res:
            return res.status, res.headers, res.read()
    except urllib.error.HTTPError as err:
        if err.code == 304:
            return 304, err.headers, b""
        detail = err.read().decode("utf-8", "replace")
        sys.exit(f"HTTP {err.code} from {url}: {detail}")


def parse_csv(text):
    """Comment header (# key: value) and rows as dicts, per the pulseloom-schedule/1 CSV."""
    header, body = {}, []
    for line in text.splitlines():
        if line.startswith("#"):
            m = re.match(r"^# ([A-Za-z][A-Za-z0-9_]*): (.*)$", line)
            if m:
                header[m.group(1)] = m.group(2)
        else:
            body.append(line)
    return header, list(csv.DictReader(io.StringIO("\n".join(body))))


def checksum(rows):
    """sha256 over '<trial>,<onset_sample>\\n' per pulse, in file order (the manifest's checksumOf)."""
    h = hashlib.sha256()
    for r in rows:
        h.update(f"{int(r['trial'])},{int(r['onset_sample'])}\n".encode("ascii"))
    return "sha256:" + h.hexdigest()


def verify(text, expected=None, clock_hz=None, allow_preview=False):
    problems = []
    if text.startswith(PREVIEW) and not allow_preview:
        problems.append("file is a PREVIEW — NOT APPROVED FOR USE")
    header, rows = parse_csv(text)
    clk = int(header["clockHz"])
    got = checksum(rows)
    for name, want in (("file header", header.get("checksum")), ("server", expected)):
        if want is not None and want.strip('"') != got:
            problems.append(f"checksum {got} differs from the {name}'s {want}")
    if clock_hz is not None and clk != clock_hz:
        problems.append(f"schedule is placed on {clk} Hz but this rig runs at {clock_hz} Hz")
    if int(header["pulses"]) != len(rows):
        problems.append(f"header says {header['pulses']} pulses, file has {len(rows)}")
    for r in rows:
        if float(r["onset_s"]) != int(r["onset_sample"]) / clk:
            problems.append(f"trial {r['trial']} pulse {r['pulse_index']}: onset_s disagrees with onset_sample")
            break
    return header, rows, got, problems


def report(header, rows, got, problems, first):
    print(f"{header.get('protocol', '?')} v{header.get('version', '?')}: {len(rows)} pulses, "
          f"{header['trials']} trials, clock {header['clockHz']} Hz, seed {header['seed']}")
    print(f"checksum {got}")
    print("trial  pulse  onset_s               onset_sample  width_ms  amplitude  channel")
    for r in rows[:first]:
        print(f"{r['trial']:>5}  {r['pulse_index']:>5}  {r['onset_s']:<20}  {r['onset_sample']:>12}  "
              f"{r['width_ms']:>8}  {r['amplitude']} {r['unit']:<4}  {r['channel']}")
    for p in problems:
        print(f"NOT VERIFIED: {p}", file=sys.stderr)
    if not problems:
        print("verified: pulses, clock and checksum agree")
    return 1 if problems else 0


def main():
    ap = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("--file", help="verify this local CSV instead of downloading")
    ap.add_argument("--version", help="approved version id (default: the first listed)")
    ap.add_argument("--out", default=".", help="folder for downloaded files")
    ap.add_argument("--pulses", type=int, default=5, help="how many pulses to print")
    ap.add_argument("--clock-hz", type=int, help="this rig's output clock, to check the schedule against")
    ap.add_argument("--allow-preview", action="store_true", help="accept PREVIEW files (never on an animal)")
    a = ap.parse_args()

    if a.file:
        with open(a.file, encoding="utf-8") as f:
            return report(*verify(f.read(), clock_hz=a.clock_hz, allow_preview=a.allow_preview), a.pulses)

    base, token = os.environ.get("PULSELOOM_URL", "").rstrip("/"), os.environ.get("PULSELOOM_TOKEN", "")
    if not base or not token:
        sys.exit("set PULSELOOM_URL and PULSELOOM_TOKEN (the token goes in a header, never in a URL)")
    _, _, body = get(f"{base}/api/rig/v1/versions", token)
    listing = json.loads(body)
    versions = listing["versions"]
    if not versions:
        print(f"nothing approved for {listing['rig']['name']} yet")
        return 0
    chosen = next((v for v in versions if v["id"] == a.version), None) if a.version else versions[0]
    if chosen is None:
        sys.exit(f"version {a.version} is not approved for this rig")

    # Revalidate a copy we already hold (named by protocol, version and checksum prefix).
    prefix = chosen["checksum"].split(":")[1][:12]
    held = [f for f in os.listdir(a.out) if f.endswith(f"_v{chosen['version']}_{prefix}.csv")]
    etag = f'"{chosen["checksum"]}"' if held else None
    status, headers, data = get(f"{base}{chosen['files']['csv']}", token, etag)
    if status == 304:
        path = os.path.join(a.out, held[0])
        print(f"{path} is current (304 Not Modified)")
    else:
        name = re.search(r'filename="([^"]+)"', headers.get("Content-Disposition", "")).group(1)
        path = os.path.join(a.out, os.path.basename(name))
        with open(path, "wb") as f:
            f.write(data)
        print(f"saved {path}")
    with open(path, encoding="utf-8") as f:
        text = f.read()
    clock = a.clock_hz if a.clock_hz is not None else listing["rig"]["clockHz"]
    return report(*verify(text, expected=chosen["checksum"], clock_hz=clock, allow_preview=a.allow_preview), a.pulses)


if __name__ == "__main__":
    sys.exit(main())
