#!/usr/bin/env bash
# npm test: the same bootstrapping as npm start, on a separate database reset for the run, then
# unit, API and browser tests. `npm test -- api` (or unit, e2e) runs one project.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/bootstrap.sh
need_database_server
need_debian chromium chromium
need_node_modules
exec $TSX scripts/testRun.ts "$@"
