#!/usr/bin/env bash
# npm start: everything a newcomer needs, then the app. Ctrl-C stops the app and its database.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/bootstrap.sh
need_database_server
need_node_modules
exec $TSX scripts/serve.ts "$@"
