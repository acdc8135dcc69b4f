#!/usr/bin/env bash
# npm test: the same setup as npm start plus Chromium, then every suite; ends with `N passed, N failed`.
source "$(dirname "$0")/bootstrap.sh"
ensure_node_modules
ensure_postgres
ensure_chromium
exec node --import tsx scripts/test.ts
