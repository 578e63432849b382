#!/usr/bin/env bash
# npm run bench: Lumenyard side by side with its floor (scripts/bench/), on the demo data and on 5,000 items ×
# 20,000 balances × 1,000,000 moves, in databases of their own on the test MariaDB instance. Not part of npm test.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/bootstrap.sh
need_database_server
need_debian chromium chromium
need_node_modules
exec $TSX scripts/bench/run.ts "$@"
