"""Draw the app icons (a boost gauge with a fuel drop) as PNG files, standard library only.

    python tools/make_icons.py

Writes static/icons/icon-{192,512}.png (rounded square, transparent corners, "any") and
static/icons/maskable-{192,512}.png (full bleed; the drawing stays inside the central
80 % circle that platforms may crop to). A small zlib/struct PNG writer; each pixel is
sampled 4 times (2 x 2) for smooth edges. Reproducible: same bytes on every run.
"""

import math
import struct
import zlib
from pathlib import Path

OUT = Path(__file__).resolve().parent.parent / "static" / "icons"
BACKGROUND = (18, 52, 59)  # theme colour #12343b
DIAL = (244, 246, 245)
NEEDLE = (230, 120, 20)
DROP = (127, 209, 196)


def png(width, height, rows):
    """PNG bytes of RGBA rows (each a bytes object of width * 4)."""
    def chunk(kind, data):
        body = kind + data
        return struct.pack(">I", len(data)) + body + struct.pack(">I", zlib.crc32(body) & 0xFFFFFFFF)

    raw = b"".join(b"\x00" + row for row in rows)
    header = struct.pack(">IIBBBBB", width, height, 8, 6, 0, 0, 0)
    return (b"\x89PNG\r\n\x1a\n" + chunk(b"IHDR", header)
            + chunk(b"IDAT", zlib.compress(raw, 9)) + chunk(b"IEND", b""))


def shape(x, y, maskable):
    """Colour (r, g, b, a) at point (x, y) in unit coordinates (0..1, y down)."""
    cx, cy = x - 0.5, y - 0.5
    if maskable:
        scale = 0.40 / 0.5  # keep the drawing inside the safe circle (radius 0.4)
    else:
        # rounded square with transparent corners
        r = 0.18
        qx, qy = max(abs(cx) - (0.5 - r), 0.0), max(abs(cy) - (0.5 - r), 0.0)
        if qx * qx + qy * qy > r * r:
            return (0, 0, 0, 0)
        scale = 0.92
    ux, uy = cx / scale, cy / scale
    dist = math.hypot(ux, uy)
    angle = math.degrees(math.atan2(uy, ux))  # 0 = right, 90 = down
    # gauge arc: 270 degrees open at the bottom, from 135 (lower left) clockwise to 45
    sweep = (angle - 135.0) % 360.0
    if 0.33 <= dist <= 0.41 and sweep <= 270.0:
        return (*DIAL, 255)
    # ticks inside the arc every 45 degrees
    if 0.26 <= dist <= 0.31 and sweep <= 270.0 and min(sweep % 45.0, 45.0 - sweep % 45.0) < 3.5:
        return (*DIAL, 255)
    # needle pointing up-right (sweep 200 deg), a thin triangle from the hub
    needle_angle = math.radians(135.0 + 200.0)
    nx, ny = math.cos(needle_angle), math.sin(needle_angle)
    along = ux * nx + uy * ny
    across = abs(-ux * ny + uy * nx)
    if -0.03 <= along <= 0.30 and across <= 0.035 * (1 - along / 0.32):
        return (*NEEDLE, 255)
    if dist <= 0.06:
        return (*NEEDLE, 255)
    # fuel drop below the hub: a circle with a point on top
    dx, dy = ux, uy - 0.24
    if math.hypot(dx, dy) <= 0.075 or (-0.16 <= dy <= 0 and abs(dx) <= 0.075 * (1 + dy / 0.16) and dy >= -0.16):
        if dy > -0.16:
            return (*DROP, 255)
    return (*BACKGROUND, 255)


def render(size, maskable):
    rows = []
    offsets = (0.25, 0.75)
    for j in range(size):
        row = bytearray()
        for i in range(size):
            acc = [0, 0, 0, 0]
            for oy in offsets:
                for ox in offsets:
                    r, g, b, a = shape((i + ox) / size, (j + oy) / size, maskable)
                    acc[0] += r * a
                    acc[1] += g * a
                    acc[2] += b * a
                    acc[3] += a
            alpha = acc[3] / 4
            if acc[3]:
                row += bytes((round(acc[0] / acc[3]), round(acc[1] / acc[3]), round(acc[2] / acc[3]), round(alpha)))
            else:
                row += b"\x00\x00\x00\x00"
        rows.append(bytes(row))
    return png(size, size, rows)


def main():
    OUT.mkdir(parents=True, exist_ok=True)
    for size in (192, 512):
        (OUT / f"icon-{size}.png").write_bytes(render(size, maskable=False))
        (OUT / f"maskable-{size}.png").write_bytes(render(size, maskable=True))
        print(f"wrote icon-{size}.png and maskable-{size}.png")


if __name__ == "__main__":
    main()
