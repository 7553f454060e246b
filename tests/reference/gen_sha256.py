#!/usr/bin/python3
# SHA-256 digests of the byte strings m_n = bytes((7 * i + 3) % 256 for i in range(n)), n = 0..200,
# covering every padding case (one and two final blocks, the 55/56/63/64-byte boundaries).
# Source: Python's hashlib (OpenSSL), independent of coldcore's own implementation.
# rerun: /usr/bin/python3 tests/reference/gen_sha256.py > tests/reference/sha256_lengths.csv
import hashlib

print("# n,sha256_hex  (message: byte i = (7*i + 3) mod 256; generator gen_sha256.py, hashlib)")
for n in range(201):
    msg = bytes((7 * i + 3) % 256 for i in range(n))
    print(f"{n},{hashlib.sha256(msg).hexdigest()}")
