#!/usr/bin/env bash
# npm run dev: the private MariaDB and mail fake, the API server restarted on change (tsx watch),
# and Vite's dev server with hot reload on http://127.0.0.1:5173 (/api proxied to the API).
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/bootstrap.sh
need_database_server
need_node_modules
$TSX watch --clear-screen=false scripts/serve.ts --no-build &
api=$!
trap 'kill $api 2>/dev/null; wait $api 2>/dev/null' EXIT INT TERM
node_modules/.bin/vite
