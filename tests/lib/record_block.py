#!/usr/bin/python3
# SPDX-License-Identifier: MIT
"""Writes a script's figures into docs/reliability.md, between its markers.

Every figure of docs/reliability.md that a script measures is written by
that script (its --record option), never typed in. Each script owns one
block:

    <!-- NAME: begin (written by SCRIPT --record; do not edit) -->

    Measured at commit `0123456789ab` on 2026-12-02 with `COMMAND`: SUMMARY.

    BODY

    <!-- NAME: end -->

The commit is `git rev-parse --short=12 HEAD`, followed by "+ uncommitted
changes" when the tracked tree differs from it (docs/reliability.md itself
does not count: recording one block must not mark the next). A block that
is there is replaced in place, the rest of the file kept byte for byte; a
block that is not there yet is added at the end of the section named by
--section (before the next heading of the same or a higher level), or at
the end of the file. A begin marker without its end, or a block that
appears twice, is an error and nothing is written.

Command line (the shell scripts use this; Python scripts import the module):

    record_block.py stamp                      # prints the stamp as JSON
    record_block.py write --name NAME --script SCRIPT --command COMMAND
        [--summary TEXT] [--section HEADING] [--stamp-file FILE] < BODY

--stamp-file takes what `stamp` printed when the measurement began (so a
commit made while a long run went on is not the one named). The document
is docs/reliability.md of this repository, or the file named by the
environment variable NTR_RECORD_DOC (the unit test writes to a copy).
"""
import argparse
import json
import os
import re
import subprocess
import sys
import time

ROOT = os.path.dirname(os.path.dirname(os.path.dirname(os.path.abspath(__file__))))
DOC_REL = os.path.join('docs', 'reliability.md')


class RecordError(Exception):
    pass


def doc_path():
    return os.environ.get('NTR_RECORD_DOC') or os.path.join(ROOT, DOC_REL)


def _git(*args):
    r = subprocess.run(['git', '-C', ROOT] + list(args), stdout=subprocess.PIPE,
                       stderr=subprocess.DEVNULL, text=True)
    return r.stdout.strip() if r.returncode == 0 else ''


def stamp():
    """The commit measured, whether the tree differs from it, and today."""
    commit = _git('rev-parse', '--short=12', 'HEAD') or 'unknown'
    dirty = _git('status', '--porcelain', '--', '.', ':(exclude)' + DOC_REL) != ''
    return {'commit': commit, 'dirty': dirty,
            'date': time.strftime('%Y-%m-%d', time.gmtime())}


def commit_text(st):
    return '`%s`%s' % (st['commit'], ' + uncommitted changes' if st.get('dirty') else '')


def stamp_line(st, command, summary=None):
    line = 'Measured at commit %s on %s with `%s`' % (commit_text(st), st['date'], command)
    return line + (': %s.' % summary.rstrip('.') if summary else '.')


def markers(name, script):
    return ('<!-- %s: begin (written by %s --record; do not edit) -->' % (name, script),
            '<!-- %s: end -->' % name)


def _find(text, name):
    """(start, end) of the whole block NAME, or None. Any begin marker of
    that name counts, whatever script it names."""
    begins = [m.start() for m in re.finditer(r'<!-- %s: begin\b[^\n]*-->' % re.escape(name), text)]
    end_marker = '<!-- %s: end -->' % name
    ends = [m.start() for m in re.finditer(re.escape(end_marker), text)]
    if not begins and not ends:
        return None
    if len(begins) != 1 or len(ends) != 1 or ends[0] < begins[0]:
        raise RecordError('%s: block %s: %d begin and %d end markers (need one of each, in order)'
                          % (doc_path(), name, len(begins), len(ends)))
    return begins[0], ends[0] + len(end_marker)


def block_body(text, name):
    """The text between the markers of block NAME (None when absent)."""
    span = _find(text, name)
    if span is None:
        return None
    inner = text[span[0]:span[1]]
    return inner[inner.index('-->') + 3:inner.rindex('<!--')]


def _section_end(text, heading):
    """Offset just before the heading that ends section HEADING."""
    m = re.search(r'^(#+) %s[ \t]*(\{#[^}]*\})?[ \t]*$' % re.escape(heading), text, re.M)
    if not m:
        raise RecordError('%s: no section "%s"' % (doc_path(), heading))
    level = len(m.group(1))
    nxt = re.compile(r'^#{1,%d} ' % level, re.M).search(text, m.end())
    return nxt.start() if nxt else len(text)


def replace_block(text, name, script, body, section=None):
    """TEXT with block NAME holding BODY (markers added here)."""
    begin, end = markers(name, script)
    block = begin + '\n\n' + body.strip('\n') + '\n\n' + end
    span = _find(text, name)
    if span is not None:
        return text[:span[0]] + block + text[span[1]:]
    if section:
        at = _section_end(text, section)
        head = text[:at].rstrip('\n')
        tail = text[at:]
        return head + '\n\n' + block + '\n' + ('\n' + tail if tail else '')
    return text.rstrip('\n') + '\n\n' + block + '\n'


def write(name, script, body, section=None):
    path = doc_path()
    with open(path, encoding='utf-8') as f:
        text = f.read()
    new = replace_block(text, name, script, body, section)
    if new != text:
        with open(path, 'w', encoding='utf-8') as f:
            f.write(new)
    return path


def record(name, script, command, body='', summary=None, section=None, st=None):
    """Writes block NAME: the stamp line, then BODY."""
    st = st or stamp()
    parts = [stamp_line(st, command, summary)]
    if body.strip():
        parts.append(body.strip('\n'))
    return write(name, script, '\n\n'.join(parts), section)


def main(argv):
    ap = argparse.ArgumentParser(description='write a figures block of docs/reliability.md')
    sub = ap.add_subparsers(dest='what', required=True)
    sub.add_parser('stamp')
    w = sub.add_parser('write')
    w.add_argument('--name', required=True)
    w.add_argument('--script', required=True)
    w.add_argument('--command', required=True)
    w.add_argument('--summary')
    w.add_argument('--section')
    w.add_argument('--stamp-file')
    a = ap.parse_args(argv)
    if a.what == 'stamp':
        print(json.dumps(stamp()))
        return 0
    st = None
    if a.stamp_file:
        with open(a.stamp_file, encoding='utf-8') as f:
            st = json.load(f)
    try:
        path = record(a.name, a.script, a.command, sys.stdin.read(), a.summary, a.section, st)
    except RecordError as e:
        print('record_block.py: %s' % e, file=sys.stderr)
        return 1
    print('record_block.py: wrote block %s of %s' % (a.name, os.path.relpath(path)))
    return 0


if __name__ == '__main__':
    sys.exit(main(sys.argv[1:]))
