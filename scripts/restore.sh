#!/usr/bin/env bash
# npm run restore -- <backup folder>: brings an EMPTY database and upload store back to exactly the state in the
# backup. It checks every file against SHA256SUMS first, and refuses a database that has tables or an upload
# folder that has files: nothing is overwritten. Stop the app (and the upload service) before restoring.
# Settings as for backup.sh: DB_NAME, DB_HOST, DB_PORT, DB_USER, DB_PASSWORD, UPLOADS_DIR.
set -euo pipefail
ROOT=$(cd "$(dirname "$0")/.." && pwd)
SRC="${1:?usage: npm run restore -- <backup folder>}"
DB_NAME="${DB_NAME:-scribeline}"
DB_HOST="${DB_HOST:-127.0.0.1}"
DB_PORT="${DB_PORT:-3406}"
DB_USER="${DB_USER:-scribeline}"
export MYSQL_PWD="${DB_PASSWORD:-scribeline-local}"
UPLOADS_DIR="${UPLOADS_DIR:-$ROOT/.data/uploads}"

[ -f "$SRC/manifest.json" ] && [ -f "$SRC/database.sql" ] && [ -f "$SRC/SHA256SUMS" ] || { echo "$SRC is not a complete Scribeline backup (manifest.json, database.sql, SHA256SUMS)." >&2; exit 2; }
CLIENT=$(command -v mariadb || command -v mysql || true)
[ -n "$CLIENT" ] || { echo "The mariadb client is missing: apt-get install mariadb-client" >&2; exit 1; }
sql() { "$CLIENT" --no-defaults -h "$DB_HOST" -P "$DB_PORT" -u "$DB_USER" "$@"; }

echo "› Checking the backup's files against SHA256SUMS"
(cd "$SRC" && sha256sum --quiet -c SHA256SUMS) || { echo "The backup is damaged: see the lines above. Nothing was restored." >&2; exit 1; }

TABLES=$(sql -N -B -e "SELECT COUNT(*) FROM information_schema.tables WHERE table_schema = '$DB_NAME'")
[ "$TABLES" = 0 ] || { echo "Database $DB_NAME has $TABLES tables: restore only into an empty database (create a fresh one)." >&2; exit 2; }
if [ -d "$UPLOADS_DIR/files" ] && [ -n "$(ls -A "$UPLOADS_DIR/files")" ]; then
  echo "$UPLOADS_DIR/files is not empty: restore only into an empty upload store." >&2; exit 2
fi

echo "› Loading the database into $DB_NAME on $DB_HOST:$DB_PORT"
sql --default-character-set=utf8mb4 "$DB_NAME" <"$SRC/database.sql"
echo "› Restoring uploaded files into $UPLOADS_DIR"
mkdir -p "$UPLOADS_DIR/files"
cp -a "$SRC/uploads/files/." "$UPLOADS_DIR/files/"
echo "Restored $(grep -o '"createdAt": "[^"]*"' "$SRC/manifest.json" | cut -d'"' -f4) backup into $DB_NAME and $UPLOADS_DIR"
