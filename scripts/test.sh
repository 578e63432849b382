#!/usr/bin/env bash
# npm test: the same bootstrapping as npm start, on a separate database reset for the run, then
# unit, API and browser tests. `npm test -- api` (or unit, e2e) runs one project.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/bootstrap.sh
need_database_server
need_debian chromium chromium
# Outside checkers of what Lumenyard prints and exports: a zip reader, a PDF rasteriser, a barcode reader
# and a spreadsheet program (headless).
need_debian unzip unzip
need_debian pdftoppm poppler-utils
need_debian zbarimg zbar-tools
need_debian soffice libreoffice-calc-nogui
# The crash and scale tests (npm run test:faults) put Debian's nginx in front of two app processes.
if [[ " $* " == *" faults "* ]]; then need_debian nginx nginx; fi
need_node_modules
exec $TSX scripts/testRun.ts "$@"
