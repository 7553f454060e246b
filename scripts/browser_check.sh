#!/usr/bin/env bash
# The HTML report in a real browser: Debian's chromium (installed here only when missing, as
# deps.sh does) loads a report, prints it to PDF on A4 and on letter, and takes a screenshot.
# It passes when the page loads without console messages, the dumped DOM has the plots and the
# cautions, the page is no wider than 180 mm (A4 less margins) at that viewport width, every
# plot box in the screenshot has drawn pixels (and the centre curve's blue where it belongs),
# and each PDF has pages of the right size; page 2 of the A4 print carries the running header and
# footer (title, date, "page 2 of N"), read back with pdftotext (poppler-utils).
#
# usage: scripts/browser_check.sh MAKE_SAMPLE_REPORT OUT_DIR
#   MAKE_SAMPLE_REPORT  the make_sample_report test program (writes a synthetic report as html)
#   OUT_DIR             where the report, screenshot, PDFs and logs go (created, emptied)
# Exit: 0 pass, 1 fail, 77 skipped (chromium not installed and cannot be installed).
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
make_sample="${1:?usage: browser_check.sh MAKE_SAMPLE_REPORT OUT_DIR}"
out="${2:?usage: browser_check.sh MAKE_SAMPLE_REPORT OUT_DIR}"
py=/usr/bin/python3
measure="$root/tests/browser/browser_measure.py"

source "$root/scripts/deps.sh"
if ! command -v chromium >/dev/null 2>&1; then
  if ! (coldcore_install_missing chromium) || ! command -v chromium >/dev/null 2>&1; then
    echo "browser check: SKIPPED: chromium is not installed and could not be installed (apt-get install chromium)"
    exit 77
  fi
fi
echo "browser check: $(chromium --version 2>/dev/null || echo chromium)"

rm -rf "$out"
mkdir -p "$out"
out="$(cd "$out" && pwd)"
"$make_sample" "$out/report.html"
"$make_sample" "$out/report_F.html" F
$py "$measure" static "$out/report.html"
$py "$measure" static "$out/report_F.html"

# A fresh profile per run; nothing that could reach the network or update itself.
flags=(--headless --no-sandbox --disable-gpu --disable-quic --no-first-run --disable-background-networking
       --disable-component-update --disable-sync --disable-extensions --hide-scrollbars
       --force-device-scale-factor=1 --user-data-dir="$out/profile")
chrome() { timeout 120 chromium "${flags[@]}" "$@"; }

# 1. Load the report as it is, with the console logged to stderr.
chrome --enable-logging=stderr --v=0 --window-size=800,1200 --dump-dom "file://$out/report.html" \
  >"$out/dom.html" 2>"$out/console.log" || { echo "browser check: FAIL: chromium exited $?"; exit 1; }
if grep -E ':CONSOLE|Uncaught|net::ERR_' "$out/console.log"; then
  echo "browser check: FAIL: console messages while loading the report (above; full log $out/console.log)"
  exit 1
fi
echo "console: no console messages, no failed loads"
# The console check must be able to fail: a copy that logs an error has to be caught.
sed 's|</body>|<script>console.error("planted error")</script>\n</body>|' "$out/report.html" >"$out/planted.html"
chrome --enable-logging=stderr --v=0 --window-size=800,1200 --dump-dom "file://$out/planted.html" \
  >/dev/null 2>"$out/planted.log" || true
if ! grep -q ':CONSOLE.*planted error' "$out/planted.log"; then
  echo "browser check: FAIL: a planted console error was not seen in the log ($out/planted.log)"
  exit 1
fi
echo "console: a planted console error is caught, as it should be"
$py "$measure" dom-loaded "$out/dom.html"

# 2. Layout numbers from an instrumented copy: the page width at 680 px (180 mm at 96 px/in)
#    and the plot boxes at 800 px, where the screenshot is taken.
$py "$measure" inject-measure "$out/report.html" "$out/measure.html"
chrome --window-size=680,1000 --dump-dom "file://$out/measure.html" >"$out/measure_680.dom" 2>/dev/null
$py "$measure" read-measure "$out/measure_680.dom" >"$out/measure_680.json"
read -r sw iw < <($py -c 'import json,sys; m=json.load(open(sys.argv[1])); print(m["scrollWidth"], m["innerWidth"])' "$out/measure_680.json")
if [ "$sw" -gt "$iw" ]; then
  echo "browser check: FAIL: at ${iw} px (180 mm) the page is ${sw} px wide: it would be cut on A4"
  exit 1
fi
echo "width: ${sw} px of ${iw} px at the A4 text width"
chrome --window-size=800,1000 --dump-dom "file://$out/measure.html" >"$out/measure_800.dom" 2>/dev/null
$py "$measure" read-measure "$out/measure_800.dom" >"$out/measure_800.json"
height="$($py -c 'import json,sys; print(min(16000, json.load(open(sys.argv[1]))["scrollHeight"]))' "$out/measure_800.json")"

# 3. Screenshot of the whole page, then count drawn pixels inside each plot box.
chrome --window-size=800,"$height" --screenshot="$out/report.png" "file://$out/report.html" >/dev/null 2>&1
$py "$measure" pixels "$out/report.png" "$out/measure_800.json"

# The pixel check must be able to fail: the same page with its plots hidden has to fail it.
$py "$measure" inject-page "$out/report.html" "$out/hidden.html" A4
sed -i 's|</head>|<style>svg.plot { visibility: hidden; }</style>\n</head>|' "$out/hidden.html"
chrome --window-size=800,"$height" --screenshot="$out/hidden.png" "file://$out/hidden.html" >/dev/null 2>&1
if $py "$measure" pixels "$out/hidden.png" "$out/measure_800.json" >"$out/hidden.log"; then
  echo "browser check: FAIL: the pixel check passed a page whose plots are hidden"
  exit 1
fi
echo "pixels: a page with hidden plots fails the check, as it should"

# 4. Print on A4 and on letter.
for size in A4 letter; do
  $py "$measure" inject-page "$out/report.html" "$out/print_$size.html" "$size"
  chrome --no-pdf-header-footer --print-to-pdf="$out/report_$size.pdf" "file://$out/print_$size.html" >/dev/null 2>&1
  $py "$measure" pdf "$out/report_$size.pdf" "$size"
done

# 5. The printed record's running header and footer (issue 16): page 2 of the A4 print carries the
# title, the date and "page 2 of N". pdftotext comes from Debian's poppler-utils (installed here
# when missing). The check must be able to fail: the same page without the margin boxes fails it.
if command -v pdftotext >/dev/null 2>&1 || (coldcore_install_missing poppler-utils) >/dev/null 2>&1; then
  title="$(sed -n 's:.*<title>\(.*\)</title>.*:\1:p' "$out/report.html" | head -1 | sed 's/&quot;/"/g; s/&lt;/</g; s/&gt;/>/g; s/&amp;/\&/g')"
  running_ok() {  # PDF: page 2 has the title's start, the footer's page count and the caution line
    local text
    text="$(pdftotext -f 2 -l 2 -layout "$1" - 2>/dev/null)"
    grep -qF "${title:0:24}" <<<"$text" && grep -qE "page 2 of [0-9]+" <<<"$text" &&
      grep -qF "engineering estimate: see the cautions" <<<"$text"
  }
  pages="$(pdfinfo "$out/report_A4.pdf" 2>/dev/null | sed -n 's/^Pages: *//p')"
  if [ "${pages:-0}" -lt 2 ]; then
    echo "browser check: FAIL: the A4 print has ${pages:-0} page(s); the running header needs a page 2"
    exit 1
  fi
  if ! running_ok "$out/report_A4.pdf"; then
    echo "browser check: FAIL: page 2 of the A4 print lacks the running header or footer"
    pdftotext -f 2 -l 2 -layout "$out/report_A4.pdf" - | head -5
    exit 1
  fi
  sed 's|<style>@page { @top-left[^<]*</style>||' "$out/print_A4.html" > "$out/no_running.html"
  chrome --no-pdf-header-footer --print-to-pdf="$out/no_running.pdf" "file://$out/no_running.html" >/dev/null 2>&1
  if running_ok "$out/no_running.pdf"; then
    echo "browser check: FAIL: the running-header check passed a print without one"
    exit 1
  fi
  echo "running header: page 2 of $pages has the title, the page count and the caution line; a print without them fails"
else
  echo "running header: SKIPPED: poppler-utils (pdftotext) could not be installed"
fi
echo "browser check: PASS (files in $out)"
