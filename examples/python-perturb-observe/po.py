#!/usr/bin/env python3
"""Perturb and observe as a separate process, speaking the MpptArena tracker host protocol (version 1)
on its standard streams: see docs/tracker-host-protocol.md. Standard library only.

Run it from a scenario with
    - { name: py-po, type: process, command: [python3, po.py], period_ms: 10 }
Anything written to standard error lands in logs/<tracker>.log; standard output carries frames only.
"""
import struct
import sys

HELLO, CREATE, CREATED, STEP, COMMAND, DESTROY, DESTROYED, ERROR, WAKE = 1, 2, 3, 4, 5, 6, 7, 8, 11
PROTOCOL_VERSION = 1
VOLTAGE_REFERENCE = 0

inp = sys.stdin.buffer
out = sys.stdout.buffer


def read_exactly(n):
    data = b""
    while len(data) < n:
        chunk = inp.read(n - len(data))
        if not chunk:
            return None
        data += chunk
    return data


def read_frame():
    header = read_exactly(4)
    if header is None:
        return None, None
    (length,) = struct.unpack("<I", header)
    body = read_exactly(length)
    if body is None:
        raise EOFError("stream ended inside a frame")
    return body[0], body[1:]


def text(s):
    b = s.encode("utf-8")
    return struct.pack("<I", len(b)) + b


def read_text(payload, pos):
    (n,) = struct.unpack_from("<I", payload, pos)
    pos += 4
    return payload[pos:pos + n].decode("utf-8"), pos + n


def send(frame_type, payload=b""):
    out.write(struct.pack("<IB", len(payload) + 1, frame_type) + payload)
    out.flush()


PARAMETERS = [("step_v", "V", 1.0, 0.01, 50.0, "Perturbation of the voltage reference"),
              ("start_fraction", "-", 0.8, 0.3, 1.0, "Start reference as a fraction of the STC open-circuit voltage")]


def hello():
    payload = struct.pack("<IIB", PROTOCOL_VERSION, 0, VOLTAGE_REFERENCE) + text("Python perturb and observe (example)")
    payload += struct.pack("<I", len(PARAMETERS))
    for name, unit, default, low, high, description in PARAMETERS:
        payload += text(name) + text(unit) + struct.pack("<ddd", default, low, high) + text(description)
    send(HELLO, payload)


class Tracker:
    def __init__(self, context, values):
        (self.period_s, self.min_command, self.max_command, self.voc_v, self.isc_a,
         self.voltage_lsb_v, self.current_lsb_a, self.voltage_bits, self.current_bits) = context
        self.step_v = values.get("step_v", 1.0)
        self.reference_v = values.get("start_fraction", 0.8) * self.voc_v
        self.last_power_w = 0.0
        self.direction = 1.0

    def step(self, voltage_v, current_a):
        power_w = voltage_v * current_a
        if power_w < self.last_power_w:
            self.direction = -self.direction
        self.last_power_w = power_w
        self.reference_v = min(max(self.reference_v + self.direction * self.step_v, self.min_command), self.max_command)
        return self.reference_v


def main():
    hello()
    tracker = None
    while True:
        frame_type, payload = read_frame()
        if frame_type is None:
            return 0
        if frame_type == CREATE:
            context = struct.unpack_from("<dddddddii", payload, 0)
            pos = struct.calcsize("<dddddddii")
            (count,) = struct.unpack_from("<I", payload, pos)
            pos += 4
            values = {}
            for _ in range(count):
                name, pos = read_text(payload, pos)
                (values[name],) = struct.unpack_from("<d", payload, pos)
                pos += 8
            tracker = Tracker(context, values)
            send(CREATED, struct.pack("<d", tracker.reference_v))
        elif frame_type == STEP:
            sequence, time_s, voltage_v, current_a = struct.unpack_from("<Iddd", payload, 0)
            try:
                command = tracker.step(voltage_v, current_a)
            except Exception as e:  # report, do not die: the arena names the failure
                send(ERROR, text("threw " + type(e).__name__) + text(str(e)) + text(""))
                continue
            send(COMMAND, struct.pack("<Id", sequence, command))
        elif frame_type == DESTROY:
            tracker = None
            send(DESTROYED)
        elif frame_type == WAKE:
            pass
        else:
            print(f"po.py: unexpected frame type {frame_type}", file=sys.stderr)
            return 2


if __name__ == "__main__":
    sys.exit(main())
