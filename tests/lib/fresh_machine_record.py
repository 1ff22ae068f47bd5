#!/usr/bin/python3
# SPDX-License-Identifier: MIT
"""Writes the fresh-machine table of docs/reliability.md from a run's results.

tests/fresh-machine.sh writes <workdir>/results.tsv as it goes, one fact a
line, three fields separated by tabs:

    run       command   bash tests/fresh-machine.sh --record both
    run       date      2026-12-02
    bookworm  version   12.15             (the chroot's /etc/debian_version)
    bookworm  commit    0123456789ab      (HEAD of the clone it tested)
    bookworm  demo      ok
    bookworm  tests     ok 45 passed, 0 failed, 0 skipped in 10 min 5 s
    bookworm  recipe    ok (library in /usr/local/lib)
    bookworm  python    ok (['fall_over_24h'])
    bookworm  sql       ok (/usr/lib/postgresql/15/bin; 2 patients assessed)

(the last five are the "result: NAME ..." lines printed inside the chroot,
"FAILED ..." when a step failed). With --record, fresh-machine.sh calls

    fresh_machine_record.py <workdir>/results.tsv

which renders one table row per release and writes the block
"fresh-machine.sh" through tests/lib/record_block.py. Nothing in the row is
typed in: a missing result is written as "FAILED (no result)".
"""
import os
import re
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import record_block  # noqa: E402

NAME = 'fresh-machine.sh'
SCRIPT = 'tests/fresh-machine.sh'
SECTION = 'Fresh machines: Debian 12 and Debian 13'
STEPS = ('demo', 'tests', 'recipe', 'python', 'sql')
HEADER = ('| release | commit | demo | test command | time of the test command '
          '| install recipe | Python block | SQL block |\n'
          '|---|---|---|---|---|---|---|---|')


def read_results(path):
    """{'run': {...}, release: {...}, ...} and the releases in file order."""
    facts, order = {}, []
    with open(path, encoding='utf-8') as f:
        for n, line in enumerate(f, 1):
            line = line.rstrip('\n')
            if not line or line.startswith('#'):
                continue
            parts = line.split('\t', 2)
            if len(parts) != 3:
                raise ValueError('%s:%d: want three tab-separated fields' % (path, n))
            who, key, value = parts
            if who != 'run' and who not in facts:
                order.append(who)
            facts.setdefault(who, {})[key] = value.strip()
    if 'run' not in facts or 'command' not in facts['run'] or 'date' not in facts['run']:
        raise ValueError('%s: no "run command" or "run date" line' % path)
    if not order:
        raise ValueError('%s: no release' % path)
    return facts, order


def cell(text):
    return text.replace('|', '\\|')


def detail(result):
    """'ok (x; y)' -> ('ok', 'x; y'); 'FAILED (x)' -> ('FAILED', 'x')."""
    m = re.match(r'^(\S+)\s*(?:\((.*)\))?\s*$', result)
    return (m.group(1), m.group(2) or '') if m else (result, '')


def tests_cells(result):
    """The test command's counts and time, from 'ok|FAILED SUMMARY in M min S s'."""
    m = re.match(r'^(\S+) (.*) in (\d+) min (\d+) s$', result)
    if not m:
        return cell(result or 'FAILED (no result)'), ''
    status, summary, mins, secs = m.groups()
    counts = re.fullmatch(r'\d+ passed, \d+ failed, \d+ skipped', summary)
    text = summary if counts else '%s (last line: `%s`)' % (status, summary.replace('`', "'"))
    if counts and status != 'ok':
        text = '%s: %s' % (status, summary)
    return cell(text), '%s min %s s' % (mins, secs)


def step_cell(step, result):
    if not result:
        return 'FAILED (no result)'
    status, more = detail(result)
    if status != 'ok':
        return cell(result)
    if step == 'python' and more:
        return 'ok (`%s`)' % more.replace('`', "'")
    if step == 'sql' and more:
        m = re.match(r'^/usr/lib/postgresql/(\d+)/bin; (.*)$', more)
        if m:
            return cell('ok, PostgreSQL %s, %s' % m.groups())
    return cell('ok, ' + more if more else 'ok')


def row(release, f):
    name = 'Debian %s (%s)' % (f.get('version', '?'), release)
    counts, took = tests_cells(f.get('tests', ''))
    return '| %s | `%s` | %s | %s | %s | %s | %s | %s |' % (
        name, f.get('commit', '?'), step_cell('demo', f.get('demo', '')), counts, took,
        step_cell('recipe', f.get('recipe', '')), step_cell('python', f.get('python', '')),
        step_cell('sql', f.get('sql', '')))


def render(facts, order):
    """(stamp, summary, body) of the block."""
    commits = sorted(set(facts[r].get('commit', '?') for r in order))
    st = {'commit': ', '.join(commits), 'dirty': False, 'date': facts['run']['date']}
    summary = ('%s%s; after the two README commands, the install recipe, the Python block '
               'and the SQL block as README.md writes them (the SQL on a throwaway server '
               'with an invented two-patient table)'
               % (' and '.join('Debian %s' % facts[r].get('version', r) for r in order),
                  ', one chroot after the other' if len(order) > 1 else ''))
    body = HEADER + '\n' + '\n'.join(row(r, facts[r]) for r in order)
    return st, summary, body


def main(argv):
    if len(argv) != 1:
        print('usage: fresh_machine_record.py RESULTS.tsv', file=sys.stderr)
        return 2
    try:
        facts, order = read_results(argv[0])
        st, summary, body = render(facts, order)
        path = record_block.record(NAME, SCRIPT, facts['run']['command'], body, summary,
                                   SECTION, st)
    except (ValueError, OSError, record_block.RecordError) as e:
        print('fresh_machine_record.py: %s' % e, file=sys.stderr)
        return 1
    print('fresh_machine_record.py: wrote block %s of %s' % (NAME, os.path.relpath(path)))
    return 0


if __name__ == '__main__':
    sys.exit(main(sys.argv[1:]))
