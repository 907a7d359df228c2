#!/usr/bin/env python3
"""Hottest frames of an async-profiler collapsed-stack file (one line a stack, frames ';'-separated,
root first, then a sample count; with 'threads' the thread name is the root frame): by thread,
self (the leaf frame) and inclusive (anywhere on the stack).
Usage: hot.py FILE.collapsed [TOP] [THREAD-SUBSTRING]"""
import collections, re, sys

path = sys.argv[1]
top = int(sys.argv[2]) if len(sys.argv) > 2 else 25
only = sys.argv[3] if len(sys.argv) > 3 else None
self_c, incl_c, threads = collections.Counter(), collections.Counter(), collections.Counter()
n = 0
for line in open(path):
    stack, _, count = line.rstrip("\n").rpartition(" ")
    if not stack:
        continue
    count = int(count)
    frames = stack.split(";")
    thread = re.sub(r"\d+", "N", frames[0].strip("[]"))
    if only and only not in thread:
        continue
    n += count
    threads[thread] += count
    self_c[frames[-1]] += count
    for f in set(frames[1:]):
        incl_c[f] += count
print(f"{n} samples")
print("threads:", ", ".join(f"{t} {c * 100 / n:.1f}%" for t, c in threads.most_common(10)))
print("--- self")
for f, c in self_c.most_common(top):
    print(f"{c * 100 / n:5.1f}%  {f}")
print("--- inclusive")
for f, c in incl_c.most_common(top * 3):
    print(f"{c * 100 / n:5.1f}%  {f}")
