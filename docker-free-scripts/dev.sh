#!/usr/bin/env bash
# npm run dev: the same local services as npm start (dev profile, same data), but the app runs
# with `next dev` (hot reload) on 127.0.0.1:3000 instead of next build + next start.
set -euo pipefail
cd "$(dirname "$0")/.."
exec bash docker-free-scripts/start.sh --dev "$@"
