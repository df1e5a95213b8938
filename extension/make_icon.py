#!/usr/bin/python3
"""Writes extension/icon.png, the extension's 42 x 42 icon in the Extension
Manager: three tally bars of different heights (the groups' rates) under a
dashed line (the target), our own drawing. Pure Python (zlib, struct), so it
needs nothing beyond the interpreter:

    /usr/bin/python3 extension/make_icon.py extension/icon.png
"""
import struct
import sys
import zlib

SIZE = 42
BACKGROUND = (255, 255, 255, 0)
BAR = (31, 96, 140, 255)
TARGET = (196, 72, 36, 255)
FRAME = (90, 90, 90, 255)


def pixels():
    img = [[BACKGROUND for _ in range(SIZE)] for _ in range(SIZE)]
    # Three bars on a base line, heights as rates of 62 %, 88 % and 74 %.
    base = 36
    for left, height in ((8, 17), (18, 25), (28, 21)):
        for y in range(base - height, base):
            for x in range(left, left + 7):
                img[y][x] = BAR
    for x in range(5, 38):
        img[base][x] = FRAME
    # The target: a dashed line across, above the first and third bars.
    for x in range(5, 38):
        if (x // 3) % 2 == 0:
            img[12][x] = TARGET
            img[13][x] = TARGET
    return img


def png(img):
    raw = b"".join(b"\x00" + b"".join(bytes(p) for p in row) for row in img)

    def chunk(kind, data):
        return struct.pack(">I", len(data)) + kind + data + struct.pack(">I", zlib.crc32(kind + data) & 0xFFFFFFFF)

    header = struct.pack(">IIBBBBB", SIZE, SIZE, 8, 6, 0, 0, 0)  # 8-bit RGBA
    return b"\x89PNG\r\n\x1a\n" + chunk(b"IHDR", header) + chunk(b"IDAT", zlib.compress(raw, 9)) + chunk(b"IEND", b"")


if __name__ == "__main__":
    with open(sys.argv[1], "wb") as f:
        f.write(png(pixels()))
