#!/usr/bin/env bash
# npm run backup [-- <folder>]: a consistent snapshot of Scribeline's database and uploaded files in a dated folder,
# by default .data/backups/scribeline-<UTC date and time>/ :
#   database.sql   mariadb-dump --single-transaction (one consistent read view; nothing is locked for writers)
#   uploads/files  the local upload service's stored files with their sidecars (UPLOADS_DIR, default .data/uploads)
#   SHA256SUMS     a checksum of every file in the backup; manifest.json: what, when, how many rows and files
# The folder is written under a ".partial" name and renamed only when complete. Files are copied before the dump
# and again after it (new ones only), so every file a dumped row names is in the backup; a file deleted meanwhile is
# kept (the restored clean-up removes it as an orphan). Settings: DB_NAME (scribeline), DB_HOST, DB_PORT, DB_USER,
# DB_PASSWORD, UPLOADS_DIR, BACKUP_ROOT (.data/backups). The backup holds password hashes and private files: it is
# made readable by its owner only; keep it somewhere as safe as the server.
set -euo pipefail
ROOT=$(cd "$(dirname "$0")/.." && pwd)
DB_NAME="${DB_NAME:-scribeline}"
DB_HOST="${DB_HOST:-127.0.0.1}"
DB_PORT="${DB_PORT:-3406}"
DB_USER="${DB_USER:-scribeline}"
export MYSQL_PWD="${DB_PASSWORD:-scribeline-local}"
UPLOADS_DIR="${UPLOADS_DIR:-$ROOT/.data/uploads}"
BACKUP_ROOT="${BACKUP_ROOT:-$ROOT/.data/backups}"
STAMP=$(date -u +%Y%m%d-%H%M%SZ)
DEST="${1:-$BACKUP_ROOT/scribeline-$STAMP}"
case "$DEST" in /*) ;; *) DEST="$PWD/$DEST" ;; esac
[ -e "$DEST" ] && { echo "Backup folder $DEST already exists: choose another." >&2; exit 2; }

DUMP=$(command -v mariadb-dump || command -v mysqldump || true)
[ -n "$DUMP" ] || { echo "mariadb-dump is missing: apt-get install mariadb-client" >&2; exit 1; }

umask 077
WORK="$DEST.partial"
rm -rf "$WORK"
mkdir -p "$WORK/uploads/files"
trap 'rm -rf "$WORK"' ERR INT TERM

copy_files() {
  # -n: never overwrite what an earlier pass copied; stored files never change once written.
  if [ -d "$UPLOADS_DIR/files" ]; then cp -an "$UPLOADS_DIR/files/." "$WORK/uploads/files/"; fi
}

echo "› Copying uploaded files from $UPLOADS_DIR"
copy_files
echo "› Dumping database $DB_NAME from $DB_HOST:$DB_PORT"
"$DUMP" --no-defaults -h "$DB_HOST" -P "$DB_PORT" -u "$DB_USER" --single-transaction --quick --hex-blob --no-tablespaces \
  --routines --triggers --default-character-set=utf8mb4 --skip-dump-date "$DB_NAME" >"$WORK/database.sql"
copy_files

TABLES=$(grep -c '^CREATE TABLE' "$WORK/database.sql" || true)
FILES=$(find "$WORK/uploads/files" -type f ! -name '*.json' | wc -l)
(cd "$WORK" && find . -type f ! -name SHA256SUMS -print0 | sort -z | xargs -0 sha256sum >SHA256SUMS)
cat >"$WORK/manifest.json" <<JSON
{ "format": "scribeline-backup-1", "createdAt": "$(date -u +%Y-%m-%dT%H:%M:%SZ)", "database": "$DB_NAME", "tables": $TABLES, "files": $FILES }
JSON
mv "$WORK" "$DEST"
trap - ERR INT TERM
echo "Backup written to $DEST ($TABLES tables, $FILES files)"
