#!/bin/sh
# SPDX-License-Identifier: MIT
# The JavaScript binding's tests (meson test 'js-binding'): builds
# natremia.wasm and refvectors.wasm into BUILDDIR with bindings/js/build.sh,
# then runs the package's own test command (npm test, i.e. node --test) in
# bindings/js, offline: the package has no dependencies to install.
# Exits 77 (skipped) only when clang, wasm-ld or node is absent.
#   sh tests/js/run.sh SOURCE_ROOT BUILDDIR
set -eu
root="$1"
out="$2/js"
for tool in clang wasm-ld node; do
    if ! command -v "$tool" >/dev/null 2>&1; then
        echo "js-binding: $tool not found (Debian: clang lld nodejs): skipped"
        exit 77
    fi
done
sh "$root/bindings/js/build.sh" "$out"
cd "$root/bindings/js"
export NATREMIA_WASM="$out/natremia.wasm"
export NATREMIA_REFVECTORS_WASM="$out/refvectors.wasm"
# Inside the test command every test must run: none may skip for a tool.
export NATREMIA_JS_REQUIRE_ALL=1
export npm_config_update_notifier=false npm_config_offline=true npm_config_fund=false npm_config_audit=false
if command -v npm >/dev/null 2>&1; then
    exec npm test --silent
fi
# Debian's nodejs without npm: the same command as package.json's "test".
exec node --test
