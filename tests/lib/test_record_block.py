#!/usr/bin/python3
# SPDX-License-Identifier: MIT
"""The figures writer of docs/reliability.md (meson test record-block).

tests/lib/record_block.py replaces a script's block in place or adds it at
the end of a section; tests/lib/fresh_machine_record.py renders the
fresh-machine table from a run's results file. Checked here on temporary
copies (NTR_RECORD_DOC), never on the real page:

- a block that is there is replaced exactly once, every byte outside it
  kept; a rerun with the same input changes nothing;
- a block that is not there is added at the end of its section, before the
  next heading;
- two blocks of one name, or a begin marker without its end, are refused
  and the file is left as it was;
- the fresh-machine rows come from the results file (an invented fixture,
  tests/lib/fresh-machine-fixture.tsv): counts, times, failures and
  missing results as the run wrote them.

Usage: test_record_block.py <docs/reliability.md>
"""
import os
import shutil
import subprocess
import sys
import tempfile

HERE = os.path.dirname(os.path.abspath(__file__))
sys.path.insert(0, HERE)
import record_block  # noqa: E402

FAILS = []


def check(ok, what):
    print('%s: %s' % ('ok' if ok else 'FAILED', what))
    if not ok:
        FAILS.append(what)


def run(script, args, doc, stdin=''):
    env = dict(os.environ, NTR_RECORD_DOC=doc)
    return subprocess.run(['/usr/bin/python3', os.path.join(HERE, script)] + args, env=env,
                          input=stdin, text=True, stdout=subprocess.PIPE, stderr=subprocess.STDOUT)


def read(path):
    with open(path, encoding='utf-8') as f:
        return f.read()


def put(path, text):
    with open(path, 'w', encoding='utf-8') as f:
        f.write(text)


def split_block(text, name):
    """(before, block, after) around the one block NAME."""
    begin = '<!-- %s: begin' % name
    end = '<!-- %s: end -->' % name
    a = text.index(begin)
    b = text.index(end) + len(end)
    return text[:a], text[a:b], text[b:]


STAMP = {'commit': 'fedcba987654', 'dirty': False, 'date': '2026-01-31'}


def synthetic(tmp):
    doc = os.path.join(tmp, 'synthetic.md')
    stamp_file = os.path.join(tmp, 'stamp.json')
    put(stamp_file, '{"commit": "fedcba987654", "dirty": true, "date": "2026-01-31"}')
    original = ('# Page\n\nIntro with <!-- a comment -->.\n\n## Alpha\n\nProse of alpha.\n\n'
                '<!-- demo.sh: begin (written by tests/demo.sh --record; do not edit) -->\n\n'
                'old figures 1 2 3\n\n<!-- demo.sh: end -->\n\nMore prose of alpha.\n\n'
                '## Beta\n\nProse of beta.\n\n### Beta detail\n\nDetail.\n\n## Gamma\n\nLast.\n')
    put(doc, original)
    args = ['write', '--name', 'demo.sh', '--script', 'tests/demo.sh', '--command',
            'tests/demo.sh --record', '--summary', '3 things [4s]', '--stamp-file', stamp_file]
    r = run('record_block.py', args, doc, '| a | b |\n|---|---|\n| 1 | 2 |\n')
    check(r.returncode == 0, 'write an existing block: exit 0 (%s)' % r.stdout.strip())
    want = ('<!-- demo.sh: begin (written by tests/demo.sh --record; do not edit) -->\n\n'
            'Measured at commit `fedcba987654` + uncommitted changes on 2026-01-31 with '
            '`tests/demo.sh --record`: 3 things [4s].\n\n| a | b |\n|---|---|\n| 1 | 2 |\n\n'
            '<!-- demo.sh: end -->')
    new = read(doc)
    before, _, after = split_block(original, 'demo.sh')
    check(new == before + want + after, 'the block replaced in place, the rest kept byte for byte')
    check(new.count('<!-- demo.sh: begin') == 1 and new.count('<!-- demo.sh: end -->') == 1,
          'exactly one block after the write')
    r = run('record_block.py', args, doc, '| a | b |\n|---|---|\n| 1 | 2 |\n')
    check(r.returncode == 0 and read(doc) == new, 'a rerun with the same input changes nothing')

    # A new block goes at the end of its section, before the next heading
    # of the same level (a sub-heading belongs to the section).
    args2 = ['write', '--name', 'other.sh', '--script', 'tests/other.sh', '--command',
             'tests/other.sh --record', '--section', 'Beta', '--stamp-file', stamp_file]
    r = run('record_block.py', args2, doc, 'x = 1\n')
    got = read(doc)
    block2 = ('<!-- other.sh: begin (written by tests/other.sh --record; do not edit) -->\n\n'
              'Measured at commit `fedcba987654` + uncommitted changes on 2026-01-31 with '
              '`tests/other.sh --record`.\n\nx = 1\n\n<!-- other.sh: end -->')
    check(r.returncode == 0 and got == new.replace('Detail.\n\n## Gamma',
                                                    'Detail.\n\n' + block2 + '\n\n## Gamma'),
          'a new block added at the end of section Beta, after its sub-section')
    r = run('record_block.py', args2, doc, 'x = 1\n')
    check(read(doc) == got, 'rerun of the added block: unchanged')

    # Refusals: nothing is written.
    for label, text in (
            ('two blocks of one name', got + '\n' + block2 + '\n'),
            ('a begin marker without its end', got.replace('<!-- other.sh: end -->', '')),
            ('an end marker before its begin', 'x\n<!-- zz.sh: end -->\n'
             '<!-- zz.sh: begin (written by tests/zz.sh --record; do not edit) -->\n')):
        put(doc, text)
        name = 'zz.sh' if 'zz.sh' in text else 'other.sh'
        r = run('record_block.py', ['write', '--name', name, '--script', 'tests/' + name,
                                    '--command', 'c', '--stamp-file', stamp_file], doc, 'y\n')
        check(r.returncode == 1 and read(doc) == text, '%s: refused, file unchanged' % label)
    try:
        record_block.replace_block('# A\n', 'n.sh', 'tests/n.sh', 'b', section='No such')
        check(False, 'an unknown section is refused')
    except record_block.RecordError:
        check(True, 'an unknown section is refused')


FRESH_ROWS = [
    '| Debian 12.99 (bookworm) | `0123456789ab` | ok | 45 passed, 0 failed, 0 skipped | 10 min 5 s '
    "| ok, library in /usr/local/lib | ok (`['fall_over_24h']`) | ok, PostgreSQL 15, 2 patients assessed |",
    '| Debian 13.99 (trixie) | `0123456789ab` | ok | FAILED: 40 passed, 3 failed, 1 skipped | 9 min 29 s '
    "| FAILED | ok (`['fall_over_24h']`) | FAILED (not found in README.md) |",
]


def fresh_machine(tmp, real_doc):
    fixture = os.path.join(HERE, 'fresh-machine-fixture.tsv')
    doc = os.path.join(tmp, 'reliability.md')
    shutil.copyfile(real_doc, doc)
    original = read(doc)
    r = run('fresh_machine_record.py', [fixture], doc)
    check(r.returncode == 0, 'fresh-machine record from the fixture: exit 0 (%s)' % r.stdout.strip())
    new = read(doc)
    name = 'fresh-machine.sh'
    check(new.count('<!-- %s: begin' % name) == 1 and new.count('<!-- %s: end -->' % name) == 1,
          'one fresh-machine block in the page')
    before, block, after = split_block(new, name)
    if ('<!-- %s: begin' % name) in original:
        o_before, _, o_after = split_block(original, name)
        check(before == o_before and after == o_after,
              'the page outside the fresh-machine block is unchanged')
    else:
        check((before + after).replace('\n', '') == original.replace('\n', ''),
              'the page outside the new fresh-machine block is unchanged (but for blank lines)')
    check(block.split('\n')[2] == (
        'Measured at commit `0123456789ab` on 2026-01-31 with `bash tests/fresh-machine.sh '
        '--record both`: Debian 12.99 and Debian 13.99, one chroot after the other; after the '
        'two README commands, the install recipe, the Python block and the SQL block as '
        'README.md writes them (the SQL on a throwaway server with an invented two-patient '
        'table).'), 'the stamp line names the clone\'s commit, the run\'s date and command')
    rows = [l for l in block.split('\n') if l.startswith('| Debian')]
    check(rows == FRESH_ROWS, 'one row per release, from the results file')
    for got, want in zip(rows, FRESH_ROWS):
        if got != want:
            print('  got:  %s\n  want: %s' % (got, want))
    r = run('fresh_machine_record.py', [fixture], doc)
    check(r.returncode == 0 and read(doc) == new, 'a rerun on the same results changes nothing')

    # A release whose step printed no result line, and a broken file.
    partial = os.path.join(tmp, 'partial.tsv')
    put(partial, 'run\tcommand\tbash tests/fresh-machine.sh --record bookworm\nrun\tdate\t2026-01-31\n'
                 'bookworm\tversion\t12.99\nbookworm\tcommit\t0123456789ab\nbookworm\tdemo\tok\n')
    r = run('fresh_machine_record.py', [partial], doc)
    rows = [l for l in split_block(read(doc), name)[1].split('\n') if l.startswith('| Debian')]
    check(r.returncode == 0 and rows == [
        '| Debian 12.99 (bookworm) | `0123456789ab` | ok | FAILED (no result) |  | FAILED (no result) '
        '| FAILED (no result) | FAILED (no result) |'], 'missing results are written as failed')
    kept = read(doc)
    put(partial, 'bookworm\tdemo\tok\n')
    r = run('fresh_machine_record.py', [partial], doc)
    check(r.returncode == 1 and read(doc) == kept, 'a results file without its run lines: refused')


def main():
    if len(sys.argv) != 2:
        print(__doc__)
        return 2
    check(record_block.stamp_line(STAMP, 'c --record', 'x.') ==
          'Measured at commit `fedcba987654` on 2026-01-31 with `c --record`: x.', 'stamp line')
    with tempfile.TemporaryDirectory() as tmp:
        synthetic(tmp)
        fresh_machine(tmp, sys.argv[1])
    print('test_record_block.py: %s' % ('%d check(s) failed' % len(FAILS) if FAILS else 'every check holds'))
    return 1 if FAILS else 0


if __name__ == '__main__':
    sys.exit(main())
