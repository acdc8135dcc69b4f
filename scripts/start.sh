#!/usr/bin/env bash
# npm start: set up whatever is missing, then serve Keyloom with its local fakes until Ctrl-C.
source "$(dirname "$0")/bootstrap.sh"
ensure_node_modules
ensure_postgres
exec node --import tsx scripts/start.ts
