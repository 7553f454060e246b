#!/usr/bin/env python3
"""Helpers for scripts/browser_check.sh (python3 standard library only).

  static REPORT.html                 well-formed XML after the doctype; no external URL
  inject-measure IN.html OUT.html    copy with a script that writes layout numbers into the DOM
  inject-page IN.html OUT.html SIZE  copy with @page { size: SIZE } (A4 or letter) for printing
  read-measure DOM.html              print the measured numbers (from --dump-dom output) as JSON
  dom-loaded DOM.html                the dumped DOM has the plots and the cautions box
  pixels SHOT.png MEASURE.json       count drawn pixels inside each plot area of a screenshot
  pdf FILE.pdf SIZE                  a PDF with at least one page of the expected paper size
"""
import json
import re
import struct
import sys
import xml.dom.minidom
import zlib

SVG_NS = 'xmlns="http://www.w3.org/2000/svg"'

MEASURE_SCRIPT = """<script>
(function () {
  var out = {scrollWidth: document.documentElement.scrollWidth,
             scrollHeight: document.documentElement.scrollHeight,
             innerWidth: window.innerWidth, areas: {}};
  var rects = document.querySelectorAll('rect.plot-area');
  for (var i = 0; i < rects.length; i++) {
    var b = rects[i].getBoundingClientRect();
    out.areas[rects[i].id] = [b.left + window.scrollX, b.top + window.scrollY, b.width, b.height];
  }
  var pre = document.createElement('pre');
  pre.id = 'cc-measure';
  pre.textContent = JSON.stringify(out);
  document.body.appendChild(pre);
})();
</script>
"""


def fail(msg):
    print("browser check: FAIL: " + msg)
    sys.exit(1)


def static(path):
    text = open(path, encoding="utf-8").read()
    if not text.startswith("<!DOCTYPE html>\n"):
        fail(path + ": does not start with <!DOCTYPE html>")
    try:
        xml.dom.minidom.parseString(text[len("<!DOCTYPE html>\n"):].encode("utf-8"))
    except Exception as e:  # noqa: BLE001 - any parser error is the finding
        fail(path + ": not well-formed XML: " + str(e))
    stripped = text.replace(SVG_NS, "")
    m = re.search(r"https?://", stripped)
    if m:
        fail(path + ": external URL: " + stripped[m.start():m.start() + 60])
    for bad in ("src=", "href=", "@import", "<script"):
        if bad in text:
            fail(path + ": contains " + bad)
    print("static: well-formed, %d svg, no external URL" % text.count("<svg "))


def inject(src, dst, snippet, before):
    text = open(src, encoding="utf-8").read()
    if before not in text:
        fail(src + ": no " + before)
    open(dst, "w", encoding="utf-8").write(text.replace(before, snippet + before, 1))


def read_measure(dom_path):
    dom = open(dom_path, encoding="utf-8").read()
    m = re.search(r'<pre id="cc-measure">(.*?)</pre>', dom, re.S)
    if not m:
        fail(dom_path + ": the measuring script did not run")
    raw = m.group(1).replace("&quot;", '"').replace("&amp;", "&")
    print(json.dumps(json.loads(raw), sort_keys=True))


def dom_loaded(dom_path):
    dom = open(dom_path, encoding="utf-8").read()
    for needle in ('id="plot-temperature-area"', 'id="plot-lethality-area"', 'id="cautions"', "</html>"):
        if needle not in dom:
            fail(dom_path + ": dumped DOM lacks " + needle)
    print("dom: plots and cautions present")


def read_png(path):
    data = open(path, "rb").read()
    if data[:8] != b"\x89PNG\r\n\x1a\n":
        fail(path + ": not a PNG")
    i, idat = 8, b""
    while i < len(data):
        (n,) = struct.unpack(">I", data[i:i + 4])
        kind, body = data[i + 4:i + 8], data[i + 8:i + 8 + n]
        i += 12 + n
        if kind == b"IHDR":
            w, h, depth, ctype, _, _, interlace = struct.unpack(">IIBBBBB", body)
        elif kind == b"IDAT":
            idat += body
    if depth != 8 or interlace != 0 or ctype not in (2, 6):
        fail(path + ": unsupported PNG layout (depth %d, colour type %d)" % (depth, ctype))
    bpp = 3 if ctype == 2 else 4
    raw, stride = zlib.decompress(idat), w * bpp
    rows, prev, p = [], bytearray(stride), 0
    for _ in range(h):
        f, line = raw[p], bytearray(raw[p + 1:p + 1 + stride])
        p += 1 + stride
        for x in range(stride):  # PNG spec section 9 filters
            a = line[x - bpp] if x >= bpp else 0
            b = prev[x]
            c = prev[x - bpp] if x >= bpp else 0
            if f == 1:
                line[x] = (line[x] + a) & 255
            elif f == 2:
                line[x] = (line[x] + b) & 255
            elif f == 3:
                line[x] = (line[x] + (a + b) // 2) & 255
            elif f == 4:
                pa, pb, pc = abs(b - c), abs(a - c), abs(a + b - 2 * c)
                line[x] = (line[x] + (a if pa <= pb and pa <= pc else b if pb <= pc else c)) & 255
        rows.append(line)
        prev = line
    return w, h, bpp, rows


def pixels(png_path, measure_path):
    measure = json.load(open(measure_path))
    w, h, bpp, rows = read_png(png_path)
    blue = (0x00, 0x72, 0xB2)  # the centre curve (Okabe-Ito blue)
    ok = True
    for name, (left, top, width, height) in sorted(measure["areas"].items()):
        x0, y0 = int(left) + 2, int(top) + 2  # inside the frame line
        x1, y1 = int(left + width) - 2, int(top + height) - 2
        if x1 > w or y1 > h or x0 >= x1 or y0 >= y1:
            fail("%s: plot box %s outside the %dx%d screenshot" % (name, (x0, y0, x1, y1), w, h))
        drawn = near_blue = 0
        for y in range(y0, y1):
            line = rows[y]
            for x in range(x0, x1):
                r, g, b = line[x * bpp], line[x * bpp + 1], line[x * bpp + 2]
                if r < 235 or g < 235 or b < 235:
                    drawn += 1
                if abs(r - blue[0]) < 40 and abs(g - blue[1]) < 40 and abs(b - blue[2]) < 40:
                    near_blue += 1
        total = (x1 - x0) * (y1 - y0)
        share = drawn / total
        print("pixels: %s box %dx%d at (%d,%d): %d drawn (%.1f %%), %d near the centre blue"
              % (name, x1 - x0, y1 - y0, x0, y0, drawn, 100 * share, near_blue))
        # Curves, grid and labels cover a few per cent; a blank or unrendered box has ~0.
        if share < 0.01 or share > 0.9:
            ok = False
            print("pixels: %s: drawn share %.3f outside 0.01..0.9" % (name, share))
        if name != "plot-lethality-area" and near_blue < 300:
            ok = False
            print("pixels: %s: the centre curve is missing (%d blue pixels)" % (name, near_blue))
    if not measure["areas"]:
        fail("no plot areas measured")
    if not ok:
        fail("plot pixels")


def pdf(path, size):
    data = open(path, "rb").read()
    if not data.startswith(b"%PDF-"):
        fail(path + ": not a PDF")
    boxes = re.findall(rb"/MediaBox\s*\[\s*([-\d.]+)\s+([-\d.]+)\s+([-\d.]+)\s+([-\d.]+)\s*\]", data)
    if not boxes:
        fail(path + ": no page MediaBox found")
    want = {"A4": (595.28, 841.89), "letter": (612.0, 792.0)}[size]  # points: ISO 216, ANSI letter
    for b in boxes:
        wpt, hpt = float(b[2]) - float(b[0]), float(b[3]) - float(b[1])
        if abs(wpt - want[0]) > 2 or abs(hpt - want[1]) > 2:
            fail("%s: page %.1f x %.1f pt, expected %s %.1f x %.1f" % (path, wpt, hpt, size, want[0], want[1]))
    print("pdf: %s, %d page(s) of %s, %d bytes" % (path, len(boxes), size, len(data)))


def main(argv):
    cmd = argv[1] if len(argv) > 1 else ""
    if cmd == "static" and len(argv) == 3:
        static(argv[2])
    elif cmd == "inject-measure" and len(argv) == 4:
        inject(argv[2], argv[3], MEASURE_SCRIPT, "</body>")
    elif cmd == "inject-page" and len(argv) == 5:
        inject(argv[2], argv[3], "<style>@page { size: %s; }</style>\n" % argv[4], "</head>")
    elif cmd == "read-measure" and len(argv) == 3:
        read_measure(argv[2])
    elif cmd == "dom-loaded" and len(argv) == 3:
        dom_loaded(argv[2])
    elif cmd == "pixels" and len(argv) == 4:
        pixels(argv[2], argv[3])
    elif cmd == "pdf" and len(argv) == 4:
        pdf(argv[2], argv[3])
    else:
        print(__doc__)
        sys.exit(2)


if __name__ == "__main__":
    main(sys.argv)
