#!/usr/bin/env python3
"""Which Java frames lead to a given frame: for every sample whose stack holds TARGET, the nearest
Java frames above it (from the reckoner, Jetty, Javalin, JDK concurrency or SQLite code), counted.
Usage: callers.py FILE.collapsed TARGET-SUBSTRING [DEPTH]"""
import collections, sys
path, target = sys.argv[1], sys.argv[2]
depth = int(sys.argv[3]) if len(sys.argv) > 3 else 3
c = collections.Counter(); total = hit = 0
for line in open(path):
    stack, _, n = line.rstrip("\n").rpartition(" ")
    n = int(n); total += n
    fr = stack.split(";")
    idx = next((i for i, f in enumerate(fr) if target in f), None)
    if idx is None:
        continue
    hit += n
    java = [f for f in fr[1:idx] if "/" in f and not f.endswith("_[k]")]
    c[" <- ".join(reversed(java[-depth:]))] += n
print(f"{hit} of {total} samples ({hit * 100 / total:.1f}%) hold {target}")
for k, v in c.most_common(25):
    print(f"{v * 100 / total:5.1f}%  {k}")
