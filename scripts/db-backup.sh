#!/usr/bin/env bash
# `npm run db:backup [-- FILE] [--test]`: a pg_dump of the whole database in custom format (compressed, restorable
# table by table with pg_restore). FILE defaults to .data/backups/<database>-<UTC time>.dump; --test backs up
# the test database instead of the app's. The database is DATABASE_URL, else the local cluster's.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/lib/pg-tools.sh

which=app file=
for arg in "$@"; do
  case $arg in
    --test) which=test ;;
    -h|--help) sed -n '2,4s/^# //p' "$0"; exit 0 ;;
    -*) die "unknown option $arg (usage: db-backup.sh [FILE] [--test])" ;;
    *) [ -z "$file" ] || die "one file only (got $file and $arg)"; file=$arg ;;
  esac
done

url=$(database_url "$which")
name=$(url_dbname "$url")
file=${file:-.data/backups/$name-$(date -u +%Y%m%dT%H%M%SZ).dump}
mkdir -p "$(dirname "$file")"
find_pg_tools "$url"
# Written beside the target first, so an interrupted dump never leaves a truncated file under the final name.
"$PGBIN/pg_dump" --format=custom --compress=6 --file="$file.partial" --dbname="$url"
mv "$file.partial" "$file"
log "backed up database $name to $file ($(du -h "$file" | cut -f1))"
printf '%s\n' "$file"
