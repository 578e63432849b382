#!/usr/bin/env bash
# npm run bench: the reorder suggestion list against a hand-written SQL aggregate over 1,000,000 ledger moves,
# on a separate database (lumenyard_bench) of the test MariaDB instance. Not part of npm test.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/bootstrap.sh
need_database_server
need_node_modules
exec $TSX scripts/benchReorder.ts "$@"
