#!/usr/bin/env bash
# Rewrites tests/golden/<sample>.json from the current results of every samples/*.json, keeping each file's
# allow-list of warnings. Review the diff (git diff tests/golden) before committing: these are the figures
# the golden-set test holds future runs to.
set -euo pipefail
cd "$(dirname "$0")/../.."
GVF_GOLDEN_UPDATE=1 npx vitest run tests/samples.test.ts
