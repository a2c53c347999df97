"""Write a scenario with many candidates, for measuring how `report` and
`compare` scale with the number of bids (memory with /usr/bin/time -v, time
with farm-bench).

Model: the Corvel Bay demo scenario (invented) with its "premium" bid copied
N times; copy k gets a turbine efficiency of 88.0 % + 0.002 % x k and a capital
cost 1000 USD x k above the original, so every copy solves and costs a
little differently. Deterministic: no random numbers.

Usage (from the repository root):
    python3 benches/data/many_candidates.py 500 > /tmp/many.toml
"""

import re
import sys


def main() -> None:
    count = int(sys.argv[1]) if len(sys.argv) > 1 else 500
    with open("scenarios/corvel-bay-peaker.toml", encoding="utf-8") as f:
        text = f.read()
    start = text.index('[[candidate]]\nid = "premium"')
    end = text.index("[[candidate]]", start + 1)
    block = text[start:end]
    copies = []
    for k in range(count):
        b = block.replace('id = "premium"', f'id = "copy-{k}"')
        b = re.sub(r'label = "[^"]*"', f'label = "Copy {k} of bid B"', b, count=1)
        b = re.sub(
            r'turbine_efficiency = "[^"]*"',
            f'turbine_efficiency = "{88.0 + 0.002 * k:.3f} %"',
            b,
            count=1,
        )
        b = re.sub(
            r'capital_cost = "(\d+) USD"',
            lambda m: f'capital_cost = "{int(m.group(1)) + 1000 * k} USD"',
            b,
            count=1,
        )
        copies.append(b)
    sys.stdout.write(text[:end] + "".join(copies) + text[end:])


if __name__ == "__main__":
    main()
