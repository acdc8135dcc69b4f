#!/usr/bin/env bash
# npm run bench: the same setup as npm test, then every benchmark under bench/ (several minutes).
source "$(dirname "$0")/bootstrap.sh"
ensure_node_modules
ensure_postgres
ensure_chromium
exec node --import tsx bench/run-all.ts
