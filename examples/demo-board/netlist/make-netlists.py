#!/usr/bin/env python3
"""Writes the Kestrel FC-2 (invented demo board) IPC-D-356A netlists in inch and metric units.

Column layout per IPC-D-356A as summarised in shared/reference/impedance-and-standards.md §8.
Coordinates are chosen on a 0.0001 in grid so that the metric file (0.001 mm) is exact too.
Run from this folder: python3 make-netlists.py
"""

# (net, refdes, pin, x_in, y_in, through_hole)
PINS = [
    ("SCK_MCU", "U1", "14", 1.0000, 1.1000, False),
    ("SCK_MCU", "R5", "1", 1.2000, 1.1000, False),
    ("SPI0_SCK", "R5", "2", 1.2600, 1.1000, False),
    ("SPI0_SCK", "U7", "6", 2.8000, 1.1000, False),
    ("SPI0_SCK", "U9", "2", 2.8000, 1.9000, False),
    ("SPI0_SCK", "U11", "2", 1.9000, 1.9000, False),
    ("SPI0_SCK", "VIA", "", 2.0000, 1.9000, True),
    ("MOSI_MCU", "U1", "15", 1.0000, 1.0500, False),
    ("MOSI_MCU", "R6", "1", 1.1200, 1.0500, False),
    ("SPI0_MOSI", "R6", "2", 1.1800, 1.0500, False),
    ("SPI0_MOSI", "U7", "5", 2.8000, 1.0500, False),
    ("SPI0_MOSI", "U9", "3", 2.8500, 1.9000, False),
    ("SPI0_CS_FLASH", "U1", "16", 1.0000, 1.2000, False),
    ("SPI0_CS_FLASH", "U7", "1", 1.8000, 1.2000, False),
    ("SPI0_HOLD", "U1", "18", 1.0000, 1.3000, False),
    ("SPI0_HOLD", "U7", "7", 2.9000, 1.3000, False),
    ("SPI0_HOLD", "TP4", "1", 2.0000, 1.3000, False),
    ("SYNC_OUT", "U1", "20", 1.0000, 1.4000, False),
    ("SYNC_OUT", "U12", "4", 4.6000, 2.4000, True),
    ("TRIG_OUT", "U1", "21", 1.0000, 1.4500, False),
    ("TRIG_OUT", "U12", "6", 4.6000, 2.3000, True),
    ("CLK_BUF", "U3", "4", 2.0000, 0.5000, False),
    ("CLK_BUF", "R8", "1", 2.1000, 0.5000, False),
    ("CLK_ADC_1V8", "R8", "2", 2.1600, 0.5000, False),
    ("CLK_ADC_1V8", "U9", "7", 2.8000, 1.7000, False),
    ("NNAME00001", "U11", "5", 1.9500, 2.0000, False),
    ("NNAME00001", "U1", "25", 1.0500, 1.6000, False),
    ("LED_STATUS", "U1", "30", 1.1000, 1.7000, False),
    ("LED_STATUS", "D1", "1", 0.6000, 1.7000, False),
    ("VCC", "U1", "1", 0.9000, 1.0000, False),
    ("VCC", "U7", "8", 2.9000, 1.0000, False),
    ("VCC", "U9", "1", 2.7000, 1.8000, False),
    ("VCC", "U11", "1", 1.8500, 1.9500, False),
    ("VCC", "U12", "1", 4.6000, 2.1000, True),
    ("VCC", "C1", "1", 0.8000, 1.0000, False),
    ("GND", "U1", "2", 0.9000, 1.0500, False),
    ("GND", "U7", "4", 2.9000, 1.2000, False),
    ("GND", "U9", "5", 2.9000, 1.8000, False),
    ("GND", "U11", "4", 1.8500, 2.0000, False),
    ("GND", "U12", "2", 4.6000, 2.2000, True),
    ("GND", "C1", "2", 0.8000, 1.0600, False),
    ("VDD18", "U3", "1", 1.9000, 0.5000, False),
    ("VDD18", "U9", "8", 2.9000, 1.7000, False),
]
ALIASES = [("NNAME00001", "SENSOR_INT_FROM_ACCELEROMETER_U11")]


def record(net, ref, pin, x_units, y_units, through):
    code = "317" if through else "327"
    hole = "D0400P" if through else "      "
    access = "A00" if through else "A01"
    sep = "-" if pin else " "
    line = (f"{code}{net:<14.14}   {ref:<6.6}{sep}{pin:<4.4} {hole}{access}"
            f"X{x_units:+07d}Y{y_units:+07d}X0600Y0600R000 S0")
    assert len(line) <= 80, line
    assert line[41] == "X" and line[49] == "Y", line  # columns 42 and 50 (1-based)
    return line


def write(path, cust, scale, title):
    lines = [
        f"C  Kestrel FC-2 field-logger controller (invented demo board), {title}",
        "C  Written by make-netlists.py; all parts and positions are made up.",
        "P  JOB   KESTREL-FC2 REV A",
        "P  CODE  00",
        f"P  UNITS CUST {cust}",
        "P  DIM   N",
        "P  VER   IPC-D-356A",
        "P  IMAGE PRIMARY",
    ]
    for key, name in ALIASES:
        lines.append(f"P  {key} {name}")
    for net, ref, pin, x, y, th in PINS:
        lines.append(record(net, ref, pin, round(x * scale), round(y * scale), th))
    lines.append("367                  " + " " * 12 + "D1250UA00X+000500Y+000500" if cust == 0 else
                 "367                  " + " " * 12 + "D3175UA00X+012700Y+012700")
    lines.append("999")
    with open(path, "w", encoding="ascii", newline="\n") as f:
        f.write("\n".join(lines) + "\n")


write("kestrel-fc2.ipc", 0, 10000, "inch units (0.0001 in)")
write("kestrel-fc2-metric.ipc", 1, 25400, "metric units (0.001 mm)")
