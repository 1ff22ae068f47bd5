#!/usr/bin/python3
# SPDX-License-Identifier: MIT
"""Mutation testing of lib/ (docs/reliability.md, "Mutation testing").

Each mutant is one small change to one lib/*.c file:

  ror    a relational operator flipped   (<  <=  >  >=  ==  !=)
  aor    an arithmetic operator swapped  (+ and -, * and /)
  con    a numeric constant nudged       (integer +1, floating x*1.01, 0.0 -> 1e-9)
  rcd    a range check deleted           (an NTR_TRY(...) statement, or an
                                          `if (...) return NTR_ERR_...` made never true)
  loop   a loop bound moved              (a for loop starts one later, or stops one earlier)

The script copies the tracked sources of the working tree into a scratch
directory, configures one build there (no ccache, -O2 without debug info),
and for each mutant: writes the mutated file, rebuilds the unit test
programs (ninja recompiles one object), runs the unit suite (every area,
the bad-input matrix, the reference vectors) one program at a time, fastest
first, and stops at the first failure. A mutant is

  killed     a test program failed, crashed or ran past its time limit
  survived   every program passed
  stillborn  it did not compile (warnings are errors); not counted
  unchanged  it compiled to the same object file (code of another
             configuration's #if branch, or the same instructions); not counted

Survivors listed in tests/mutate-equivalent.txt (key, tab, reason) are
equivalent: no test can tell them apart from the original. The score is
killed / (compiled - equivalent).

Mutant selection is deterministic: the full list is enumerated in a fixed
order, and --sample N picks N of them with random.Random(--seed).

Usage:
  tests/mutate.py --list                      # every mutant, one per line
  tests/mutate.py --sample 40                 # 40 mutants, seed 14
  tests/mutate.py --full                      # every mutant (hours)
  tests/mutate.py --sample 200 --record       # and write docs/reliability.md
  tests/mutate.py --only KEY [--only KEY ...] # chosen mutants (keys from --list)
  tests/mutate.py --fixed tests/lib/mutants-fixed.txt
                                              # a fixed list, each mutant run
                                              # against the tests named for it;
                                              # fails unless every one is killed
                                              # (the meson test mutants-fixed)
Options: --seed S, --files lib/batch.c,lib/water.c, --workdir DIR
(default build-mutate in the repository), --keep-going (run every test
program, not only up to the first failure).
"""
import argparse
import hashlib
import json
import os
import random
import re
import shutil
import signal
import subprocess
import sys
import time

ROOT = os.path.dirname(os.path.dirname(os.path.abspath(__file__)))
sys.path.insert(0, os.path.join(ROOT, 'tests', 'lib'))
import record_block  # noqa: E402  (tests/lib/record_block.py: the shared writer)

EQUIV_FILE = os.path.join(ROOT, 'tests', 'mutate-equivalent.txt')
BLOCK = 'mutate.py'
SCRIPT = 'tests/mutate.py'
SUITE = 'natremia:unit'


# ---- finding mutation sites ----------------------------------------------

def blank_non_code(text):
    """The text with comments, string and character literals and
    preprocessor lines replaced by spaces (offsets kept)."""
    out = list(text)
    i, n = 0, len(text)
    line_start = True
    while i < n:
        c = text[i]
        if line_start and c == '#' or (line_start and c in ' \t' and
                                       text[i:].lstrip(' \t').startswith('#')):
            # a preprocessor line, with its continuations
            j = i
            while j < n:
                if text[j] == '\n' and (j == 0 or text[j - 1] != '\\'):
                    break
                j += 1
            # A #define keeps its body: the constants and expressions of
            # object-like and function-like macros are code too.
            d = re.match(r'[ \t]*#[ \t]*define[ \t]+\w+(\([^)]*\))?', text[i:j])
            keep_from = i + d.end() if d else j
            for k in range(i, keep_from):
                out[k] = ' '
            i = keep_from
            line_start = False
            continue
        line_start = False
        if text.startswith('/*', i):
            j = text.find('*/', i + 2)
            j = n if j < 0 else j + 2
            for k in range(i, j):
                if out[k] != '\n':
                    out[k] = ' '
            i = j
            continue
        if text.startswith('//', i):
            j = text.find('\n', i)
            j = n if j < 0 else j
            for k in range(i, j):
                out[k] = ' '
            i = j
            continue
        if c in '"\'':
            j = i + 1
            while j < n and text[j] != c:
                j += 2 if text[j] == '\\' else 1
            for k in range(i, min(j + 1, n)):
                if out[k] != '\n':
                    out[k] = ' '
            i = j + 1
            continue
        if c == '\n':
            line_start = True
        i += 1
    return ''.join(out)


ROR = {'<': '<=', '<=': '<', '>': '>=', '>=': '>', '==': '!=', '!=': '=='}
AOR = {'+': '-', '-': '+', '*': '/', '/': '*'}
# A relational operator not part of <<, >>, ->, <<=, >>=.
RE_ROR = re.compile(r'(?<![<>=!\-])(<=|>=|==|!=|<|>)(?![<>=])')
# A binary arithmetic operator written with a space on each side (the
# project style), so unary signs, pointers and ++/-- are left alone.
RE_AOR = re.compile(r'(?<=[\w)\]]) ([+\-*/]) (?=[\w(.])')
RE_FLOAT = re.compile(r'(?<![\w.])(\d+\.\d*(?:[eE][+-]?\d+)?|\d+[eE][+-]?\d+|\.\d+(?:[eE][+-]?\d+)?)(?![\w.])')
RE_INT = re.compile(r'(?<![\w.])(\d+)([uU]?)(?![\w.])')
RE_TRY = re.compile(r'NTR_TRY\(')
RE_IF_RETURN = re.compile(r'\bif \(')
RE_FOR = re.compile(r'\bfor \(')


def matching_paren(code, open_at):
    depth = 0
    for j in range(open_at, len(code)):
        if code[j] == '(':
            depth += 1
        elif code[j] == ')':
            depth -= 1
            if depth == 0:
                return j
    return -1


def nudge_float(lit):
    v = float(lit)
    if v == 0.0:
        return '1e-9'
    return repr(v * 1.01)


def sites(path, text):
    """(start, end, replacement, op) for every mutation of one file."""
    code = blank_non_code(text)
    found = []
    for m in RE_ROR.finditer(code):
        found.append((m.start(1), m.end(1), ROR[m.group(1)], 'ror'))
    for m in RE_AOR.finditer(code):
        found.append((m.start(1), m.end(1), AOR[m.group(1)], 'aor'))
    floats = []
    for m in RE_FLOAT.finditer(code):
        floats.append((m.start(1), m.end(1)))
        found.append((m.start(1), m.end(1), nudge_float(m.group(1)), 'con'))
    for m in RE_INT.finditer(code):
        if any(a <= m.start(1) < b for a, b in floats):
            continue
        found.append((m.start(1), m.end(1), str(int(m.group(1)) + 1), 'con'))
    for m in RE_TRY.finditer(code):
        close = matching_paren(code, m.end() - 1)
        if close > 0 and code[close + 1:close + 2] == ';':
            found.append((m.start(), close + 2, ';', 'rcd'))
    for m in RE_IF_RETURN.finditer(code):
        close = matching_paren(code, m.end() - 1)
        if close < 0:
            continue
        body = code[close + 1:close + 120]
        if re.match(r'\s*\{?\s*return NTR_ERR_\w+;', body):
            found.append((m.end(), close, '0', 'rcd'))
    for m in RE_FOR.finditer(code):
        close = matching_paren(code, m.end() - 1)
        if close < 0:
            continue
        head = code[m.end():close]
        parts = head.split(';')
        if len(parts) != 3:
            continue
        init_end = m.end() + len(parts[0])
        cond_end = init_end + 1 + len(parts[1])
        im = re.search(r'=\s*(\w+)\s*$', parts[0])
        if im:
            a = m.end() + im.start(1)
            found.append((a, a + len(im.group(1)), '(' + im.group(1) + ' + 1)', 'loop'))
        cm = re.search(r'(<=?)\s*([\w.>\-]+)\s*$', parts[1])
        if cm and '&&' not in parts[1] and '||' not in parts[1]:
            a = init_end + 1 + cm.start(2)
            found.append((a, a + len(cm.group(2)), '(' + cm.group(2) + ' - 1)', 'loop'))
        del cond_end
    return sorted(found)


class Mutant:
    def __init__(self, path, text, start, end, repl, op, occurrence):
        self.path = path            # relative to the repository
        self.start, self.end, self.repl, self.op = start, end, repl, op
        self.line = text.count('\n', 0, start) + 1
        ls = text.rfind('\n', 0, start) + 1
        le = text.find('\n', start)
        le = len(text) if le < 0 else le
        self.src = text[ls:le].strip()
        self.orig = text[start:end]
        self.occurrence = occurrence
        # The key survives edits elsewhere in the file: file, operator, the
        # line's text and which occurrence on that line.
        norm = ' '.join(self.src.split())
        self.key = '%s|%s|%d|%s|%s' % (path, op, occurrence, ' '.join(self.orig.split()), norm)
        self.id = hashlib.sha1(self.key.encode()).hexdigest()[:10]

    def apply(self, text):
        return text[:self.start] + self.repl + text[self.end:]

    def describe(self):
        return '%s:%d %s `%s` -> `%s` in `%s`' % (
            self.path, self.line, self.op, ' '.join(self.orig.split()),
            ' '.join(self.repl.split()), self.src)


def enumerate_mutants(files):
    mutants = []
    for rel in files:
        with open(os.path.join(ROOT, rel)) as f:
            text = f.read()
        seen = {}
        for start, end, repl, op in sites(rel, text):
            ls = text.rfind('\n', 0, start) + 1
            le = text.find('\n', start)
            k = (' '.join(text[ls:le].split()), op, ' '.join(text[start:end].split()))
            seen[k] = seen.get(k, 0) + 1
            mutants.append(Mutant(rel, text, start, end, repl, op, seen[k]))
    return mutants


# ---- building and testing ---------------------------------------------------

def run(cmd, cwd, timeout=None):
    return subprocess.run(cmd, cwd=cwd, stdout=subprocess.PIPE,
                          stderr=subprocess.STDOUT, timeout=timeout)


def git(*args):
    return subprocess.run(['git'] + list(args), cwd=ROOT, stdout=subprocess.PIPE,
                          stderr=subprocess.DEVNULL, text=True).stdout.strip()


def prepare(workdir, options):
    """Copy the tracked files to workdir/src and configure workdir/build."""
    src = os.path.join(workdir, 'src')
    build = os.path.join(workdir, 'build')
    files = git('ls-files', '-z').split('\0')
    for rel in files:
        if not rel or not os.path.isfile(os.path.join(ROOT, rel)):
            continue
        dst = os.path.join(src, rel)
        os.makedirs(os.path.dirname(dst), exist_ok=True)
        a = os.path.join(ROOT, rel)
        if not os.path.exists(dst) or open(a, 'rb').read() != open(dst, 'rb').read():
            # A fresh mtime, so ninja rebuilds what an interrupted run left.
            shutil.copyfile(a, dst)
    if not os.path.exists(os.path.join(build, 'build.ninja')):
        env = dict(os.environ, CC='gcc', CCACHE_DISABLE='1')
        r = subprocess.run(['meson', 'setup', build, src] + options, env=env, stdout=subprocess.PIPE,
                           stderr=subprocess.STDOUT)
        if r.returncode != 0:
            sys.exit('mutate.py: meson setup failed:\n' + r.stdout.decode(errors='replace'))
    # Regenerate first (meson.build may have changed since the last run),
    # so the test list is this tree's.
    run(['ninja', '-C', build, 'build.ninja'], build)
    tests = json.loads(run(['meson', 'introspect', '--tests'], build).stdout)
    tests = [t for t in tests if SUITE in t['suite']]
    return src, build, tests


def build_targets(build, tests):
    # Every built file a test command names: the test program itself, or
    # the program a script test drives (tests/cli/test_cli.py is given
    # bindings/cli/natremia-course as an argument).
    targets = []
    for t in tests:
        for arg in t['cmd']:
            arg = os.path.normpath(arg)
            rel = os.path.relpath(arg, build)
            if arg.startswith(build + os.sep) and rel not in targets:
                targets.append(rel)
    return targets


def objects_of(build, rel):
    """Hashes of the object files compiled from one source (shared and
    static library objects); for a header, of every library object (any
    of them may include it)."""
    found = []
    for d in sorted(os.listdir(os.path.join(build, 'lib'))):
        if not d.endswith('.p'):
            continue
        if rel.endswith('.h'):
            names = sorted(f for f in os.listdir(os.path.join(build, 'lib', d)) if f.endswith('.o'))
        else:
            names = [os.path.basename(rel) + '.o']
        for name in names:
            o = os.path.join(build, 'lib', d, name)
            if os.path.exists(o):
                found.append(hashlib.sha1(open(o, 'rb').read()).hexdigest())
    return found


def rebuild(build, targets):
    r = run(['ninja', '-C', build] + targets, build)
    return r.returncode == 0, r.stdout.decode(errors='replace')


def run_tests(build, tests, limits, keep_going):
    """None when every program passed, else the name of the first that failed."""
    failed = None
    for t in tests:
        env = dict(os.environ)
        env.update(t.get('env') or {})
        env['MALLOC_PERTURB_'] = '0'
        try:
            r = subprocess.run(t['cmd'], cwd=t.get('workdir') or build, env=env,
                               stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL,
                               timeout=limits.get(t['name'], t['timeout']))
            ok = r.returncode == 0
        except subprocess.TimeoutExpired:
            ok = False
        if not ok:
            failed = failed or t['name']
            if not keep_going:
                return failed
    return failed


# ---- a fixed list of mutants ---------------------------------------------

def load_fixed(path, allm):
    """[(name, mutant, test names, why)] from a fixed list (format in the
    file's own comments: tests/lib/mutants-fixed.txt)."""
    entries = []
    for n, line in enumerate(open(path, encoding='utf-8'), 1):
        if line.startswith('#') or not line.strip():
            continue
        fields = line.rstrip('\n').split('\t')
        if len(fields) != 4:
            sys.exit('mutate.py: %s:%d: need 4 tab-separated fields' % (path, n))
        name, where, tests, why = fields
        if re.fullmatch(r'[0-9a-f]{10}', where):
            found = [m for m in allm if m.id == where]
            if not found:
                sys.exit('mutate.py: %s:%d: %s: no mutant %s in today\'s lib/ (its line changed?)'
                         % (path, n, name, where))
            m = found[0]
        else:
            rel, _, change = where.partition(': ')
            old, sep, new = change.partition(' => ')
            if not sep:
                sys.exit('mutate.py: %s:%d: want "FILE: OLD => NEW" or a mutant id' % (path, n))
            old, new = old.replace('\\n', '\n'), new.replace('\\n', '\n')
            text = open(os.path.join(ROOT, rel), encoding='utf-8').read()
            if text.count(old) != 1:
                sys.exit('mutate.py: %s:%d: %s: the original text occurs %d times in %s (need once)'
                         % (path, n, name, text.count(old), rel))
            start = text.index(old)
            m = Mutant(rel, text, start, start + len(old), new, 'text', 1)
        entries.append((name, m, tests.split(','), why))
    return entries


# ---- recording ----------------------------------------------------------------

def equivalent_reason(eq, key):
    """The reason a key (or a pattern matching it) is listed as equivalent."""
    if key in eq:
        return eq[key]
    for pattern, reason in eq.items():
        # Only * and ? are wildcards (keys hold C brackets).
        rx = re.escape(pattern).replace('\\*', '.*').replace('\\?', '.')
        if re.fullmatch(rx, key):
            return reason
    return None


def load_equivalent():
    eq = {}
    if os.path.exists(EQUIV_FILE):
        for line in open(EQUIV_FILE):
            if line.startswith('#') or not line.strip():
                continue
            key, _, reason = line.rstrip('\n').partition('\t')
            eq[key] = reason.strip()
    return eq


def recorded_block():
    """The body of the run recorded in docs/reliability.md, or None."""
    with open(record_block.doc_path(), encoding='utf-8') as f:
        return record_block.block_body(f.read(), BLOCK)


def main():
    ap = argparse.ArgumentParser(description=__doc__.split('\n')[0])
    g = ap.add_mutually_exclusive_group()
    g.add_argument('--full', action='store_true')
    g.add_argument('--sample', type=int)
    g.add_argument('--list', action='store_true')
    g.add_argument('--only', action='append', help='a mutant key or id')
    g.add_argument('--fixed', metavar='LIST',
                   help='run the mutants of a fixed list, each against the tests named '
                   'for it; exit 1 unless every one is killed')
    g.add_argument('--recheck', action='store_true',
                   help='re-run the survivors of the run recorded in docs/reliability.md '
                   'on the current tree; with --record, add the outcome below that run')
    ap.add_argument('--seed', type=int, default=14)
    ap.add_argument('--files')
    ap.add_argument('--workdir', default=os.path.join(ROOT, 'build-mutate'))
    ap.add_argument('--record', action='store_true')
    ap.add_argument('--keep-going', action='store_true')
    ap.add_argument('--time-budget', type=float, default=0,
                    help='seconds: start no further mutant after this long (0: no limit); '
                    'the report says how many of the selection ran')
    ap.add_argument('--meson-option', dest='meson_options', action='append',
                    help='configure option for the mutant build, e.g. -Doptimization=s '
                    '(default -Dbuildtype=debugoptimized -Ddebug=false); use its own --workdir')
    a = ap.parse_args()

    files = a.files.split(',') if a.files else sorted(
        'lib/' + f for f in os.listdir(os.path.join(ROOT, 'lib')) if f.endswith('.c'))
    allm = enumerate_mutants(files)
    if a.list:
        for m in allm:
            print('%s\t%s\t%s' % (m.id, m.describe(), m.key))
        print('%d mutants' % len(allm), file=sys.stderr)
        return 0
    recorded = None
    if a.recheck:
        recorded = recorded_block()
        if recorded is None:
            sys.exit('mutate.py: no recorded run in docs/reliability.md')
        a.only = re.findall(r'^- `([0-9a-f]{10})` .*$', recorded.split('Equivalent')[0], re.M)
    fixed = None
    if a.fixed and not git('rev-parse', '--git-dir'):
        # The mutant build copies the tracked files: a tree without git has none.
        print('mutate.py --fixed: not a git checkout: skipped')
        return 77
    if a.fixed:
        fixed = load_fixed(a.fixed, allm)
        chosen = [m for _, m, _, _ in fixed]
        mode = 'a fixed list of %d mutants' % len(chosen)
    elif a.only:
        chosen = [m for m in allm if m.key in a.only or m.id in a.only]
        mode = 'chosen mutants'
    elif a.full:
        chosen = list(allm)
        mode = 'all %d mutants' % len(allm)
    else:
        n = a.sample if a.sample else 40
        chosen = random.Random(a.seed).sample(allm, min(n, len(allm)))
        mode = 'a sample of %d of the %d mutants (seed %d)' % (len(chosen), len(allm), a.seed)
    # Same file together: one recompilation per mutant.
    chosen.sort(key=lambda m: (m.path, m.start, m.repl))

    # A kill restores the mutated file too (the finally clause below).
    signal.signal(signal.SIGTERM, lambda *_: sys.exit(1))
    t0 = time.time()
    # The commit measured: the sources are copied now.
    st = record_block.stamp()
    os.makedirs(a.workdir, exist_ok=True)
    src, build, tests = prepare(a.workdir, a.meson_options or
                                ['-Dbuildtype=debugoptimized', '-Ddebug=false'])
    # A fixed list names the tests that must kill each mutant: only those
    # are built and run for it.
    tests_of = {}
    if fixed:
        by_name = {t['name']: t for t in tests}
        for name, m, names, _ in fixed:
            missing = [t for t in names if t not in by_name]
            if missing:
                sys.exit('mutate.py: %s: no unit test %s' % (name, ', '.join(missing)))
            tests_of[m.id] = [by_name[t] for t in names]
        wanted = set(t for _, _, names, _ in fixed for t in names)
        tests = [t for t in tests if t['name'] in wanted]
    targets = build_targets(build, tests)
    ok, log = rebuild(build, targets)
    if not ok:
        sys.exit('mutate.py: the unmutated build fails:\n' + log[-3000:])
    # Baseline: every program passes; its time sets its limit and the order.
    times = {}
    for t in tests:
        s = time.time()
        if run_tests(build, [t], {}, False):
            sys.exit('mutate.py: %s fails without a mutation' % t['name'])
        times[t['name']] = time.time() - s
    tests.sort(key=lambda t: times[t['name']])
    limits = {t['name']: min(t['timeout'], 10 * times[t['name']] + 10) for t in tests}

    base_objects = {rel: objects_of(build, rel) for rel in set(m.path for m in chosen)}
    results = []
    originals = {}
    for idx, m in enumerate(chosen):
        if a.time_budget and time.time() - t0 > a.time_budget:
            print('mutate.py: time budget spent after %d of %d mutants' % (idx, len(chosen)))
            mode += '; the time budget of %.0f s ended the run after %d of them' % (
                a.time_budget, idx)
            break
        path = os.path.join(src, m.path)
        if m.path not in originals:
            originals[m.path] = open(path).read()
        try:
            with open(path, 'w') as f:
                f.write(m.apply(originals[m.path]))
            mine = sorted(tests_of.get(m.id, tests), key=lambda t: times[t['name']])
            ok, _ = rebuild(build, build_targets(build, mine) if fixed else targets)
            if not ok:
                verdict, by = 'stillborn', ''
            elif objects_of(build, m.path) == base_objects[m.path]:
                # The compiler made the same object: the mutated code is not
                # in this build (an #if branch of another configuration) or
                # compiles to the same instructions. No test can see it.
                verdict, by = 'unchanged', ''
            else:
                by = run_tests(build, mine, limits, a.keep_going)
                verdict = 'killed' if by else 'survived'
        finally:
            with open(path, 'w') as f:
                f.write(originals[m.path])
        results.append((m, verdict, by or ''))
        print('[%d/%d] %-10s %s%s' % (idx + 1, len(chosen), verdict, m.describe(),
                                      (' (by ' + by + ')') if by else ''), flush=True)
    rebuild(build, targets)
    elapsed = time.time() - t0
    # Equivalence is a judgement on the mutant, read when the run ends.
    eq = load_equivalent()
    results = [(m, 'equivalent' if v == 'survived' and equivalent_reason(eq, m.key) else v, by)
               for m, v, by in results]

    if fixed:
        names = {m.id: name for name, m, _, _ in fixed}
        bad = [(m, v) for m, v, _ in results if v != 'killed']
        print('mutate.py --fixed: %d of %d mutants killed in %.0f s%s' % (
            len(results) - len(bad), len(chosen), elapsed,
            ''.join('; %s %s (%s)' % (names[m.id], v, m.describe()) for m, v in bad)))
        return 1 if bad or len(results) != len(chosen) else 0
    count = {k: sum(1 for r in results if r[1] == k)
             for k in ('killed', 'survived', 'equivalent', 'stillborn', 'unchanged')}
    scored = count['killed'] + count['survived']
    score = 100.0 * count['killed'] / scored if scored else 100.0
    command = ' '.join([SCRIPT] + sys.argv[1:])
    lines = [
        record_block.stamp_line(st, command, '%s over %s' % (
            mode, ', '.join(files) if a.files else 'every lib/*.c')),
        '',
        '| mutants | did not compile | same object code | killed | equivalent | survived | score | run time |',
        '|---|---|---|---|---|---|---|---|',
        '| %d | %d | %d | %d | %d | %d | **%.1f %%** | %.0f s |' % (
            len(results), count['stillborn'], count['unchanged'], count['killed'],
            count['equivalent'], count['survived'], score, elapsed),
        '',
        'Build: `%s`. Score: killed / (killed + survived); mutants that did not '
        'compile (warnings are errors) or compiled to the same object code '
        '(code of another configuration, such as the -Os loops or the non-SSE2 '
        'lanes of lib/batch.c) are not counted.' % ' '.join(a.meson_options or ['-Dbuildtype=debugoptimized', '-Ddebug=false']),
        '',
    ]
    surv = [r for r in results if r[1] == 'survived']
    lines.append('Survivors: ' + ('none.' if not surv else ''))
    for m, _, _ in surv:
        lines.append('- `%s` %s' % (m.id, m.describe()))
    eqs = [r for r in results if r[1] == 'equivalent']
    if eqs:
        lines.append('')
        lines.append('Equivalent (reason in tests/mutate-equivalent.txt):')
        for m, _, _ in eqs:
            lines.append('- `%s` %s: %s' % (m.id, m.describe(), equivalent_reason(eq, m.key)))
    lines.append('')
    print('\n'.join(lines))
    for m, _, _ in surv:
        print('survivor key: %s' % m.key)
    if a.record and a.recheck:
        killed = [m for m, v, _ in results if v == 'killed']
        eqv = [m for m, v, _ in results if v == 'equivalent']
        left = [m for m, v, _ in results if v == 'survived']
        row = re.search(r'^\| (\d+) \| (\d+) \| (\d+) \| (\d+) \| (\d+) \| (\d+) \|', recorded, re.M)
        k0, e0, s0 = int(row.group(4)), int(row.group(5)), int(row.group(6))
        k1, e1, s1 = k0 + len(killed), e0 + len(eqv), s0 - len(killed) - len(eqv)
        add = ['', 'Re-check at commit %s on %s (`%s`, %.0f s): '
               'of the %d survivors above, %d are now killed by tests added since, %d are '
               'listed as equivalent, %d survive. The same sample with today\'s tests: '
               '%d killed, %d equivalent, %d survived: **%.1f %%**.' % (
                   record_block.commit_text(st), st['date'], command, elapsed, len(results),
                   len(killed), len(eqv), len(left), k1, e1, s1,
                   100.0 * k1 / (k1 + s1) if k1 + s1 else 100.0)]
        if left:
            add.append('')
            add.append('Still surviving:')
            for m in left:
                add.append('- `%s` %s' % (m.id, m.describe()))
        # A new re-check replaces the previous one.
        body = recorded.split('\nRe-check at commit')[0]
        record_block.write(BLOCK, SCRIPT, body.rstrip('\n') + '\n\n' + '\n'.join(add).strip('\n'))
    elif a.record:
        record_block.write(BLOCK, SCRIPT, '\n'.join(lines))
    return 0 if score >= 95.0 else 1


if __name__ == '__main__':
    sys.exit(main())
