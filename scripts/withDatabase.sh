#!/usr/bin/env bash
# Runs a TypeScript script after the same bootstrapping as npm start (MariaDB server and client from
# Debian, npm packages): npm run backup, npm run restore.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/bootstrap.sh
need_database_server
need_debian mariadb-dump mariadb-client
need_node_modules
exec $TSX "$@"
