#!/usr/bin/env bash
# `npm run db:restore -- FILE [DATABASE] [--test] [--replace]`: restores a db:backup file with pg_restore.
# DATABASE is a database name on the same server, or a postgres:// URL; it defaults to the app database (the test
# database with --test). A missing database is created. A database that already holds tables is replaced only
# with --replace (its objects are dropped and restored from the file); without it nothing is touched.
# Everything happens in one transaction: a failed restore leaves the target as it was.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/lib/pg-tools.sh

which=app replace= file= target=
for arg in "$@"; do
  case $arg in
    --test) which=test ;;
    --replace) replace=1 ;;
    -h|--help) sed -n '2,6s/^# //p' "$0"; exit 0 ;;
    -*) die "unknown option $arg (usage: db-restore.sh FILE [DATABASE] [--test] [--replace])" ;;
    *) if [ -z "$file" ]; then file=$arg; elif [ -z "$target" ]; then target=$arg; else die "unexpected argument $arg"; fi ;;
  esac
done
[ -n "$file" ] || die "which backup? usage: npm run db:restore -- FILE [DATABASE] [--test] [--replace]"
[ -s "$file" ] || die "no backup file at $file"

base=$(database_url "$which")
case $target in
  '') url=$base ;;
  postgres://*|postgresql://*) url=$target ;;
  *) [[ $target =~ ^[A-Za-z_][A-Za-z0-9_]{0,62}$ ]] || die "database name must be letters, digits and _ (got \"$target\")"
     url=$(url_with_db "$base" "$target") ;;
esac
name=$(url_dbname "$url")
owner=${url#*://}; owner=${owner%%[:@]*}
find_pg_tools "$base"

# Creating a database needs the CREATEDB right; the app's user has none on the local cluster, so there the
# cluster's superuser creates it (over the local socket, as db.sh does) and hands it to the app's user.
create_database() {
  local sql="create database \"$name\" owner \"$owner\""
  if psql "$(url_with_db "$url" postgres)" -XqtA -c "$sql" 2>/dev/null; then return; fi
  local port=${url#*@}; port=${port#*:}; port=${port%%/*}
  if [ -f .data/postgres.env ] && [ "$(id -u)" = 0 ] && runuser -u postgres -- psql -h /tmp -p "$port" -U postgres -d postgres -XqtA -c "$sql"; then return; fi
  die "cannot create database $name: create it (owner $owner) and run the restore again"
}

exists=$(psql "$(url_with_db "$url" postgres)" -XqtA -c "select 1 from pg_database where datname = '$name'" 2>/dev/null || true)
if [ "$exists" != 1 ]; then
  create_database
  log "created database $name"
else
  tables=$(psql "$url" -XqtA -c "select count(*) from pg_tables where schemaname not in ('pg_catalog', 'information_schema')")
  if [ "$tables" != 0 ] && [ -z "$replace" ]; then
    die "database $name already holds $tables tables: add --replace to drop them and restore $file in their place"
  fi
fi

if [ -n "$replace" ]; then
  # pg_restore --clean cannot drop a partition's inherited primary key ("cannot drop inherited constraint"), and
  # pg-boss's job table (schema pgboss) is partitioned by queue: drop that schema first, in the same transaction,
  # and let --clean replace everything else. The script is written out whole first, so a pg_restore that fails
  # half-way never feeds psql a truncated restore to commit.
  script=$(mktemp "${TMPDIR:-/tmp}/dw-restore-XXXXXX.sql")
  trap 'rm -f "$script"' EXIT
  { echo 'drop schema if exists pgboss cascade;'; "$PGBIN/pg_restore" --no-owner --no-acl --clean --if-exists --file=- "$file"; } > "$script"
  psql "$url" -Xq --single-transaction -v ON_ERROR_STOP=1 -f "$script" > /dev/null
else
  "$PGBIN/pg_restore" --dbname="$url" --no-owner --no-acl --single-transaction --exit-on-error "$file"
fi
log "restored $file into database $name"
