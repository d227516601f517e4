# Sourced by the start, dev, test and bench scripts (run from the repository root).

# Dependencies, PostgreSQL (unless DATABASE_URL is set), migrations and demo data, for the app database
# (`prepare app`) or the test database (`prepare test`).
prepare() {
  bash scripts/ensure-deps.sh
  if [ -z "${DATABASE_URL:-}" ]; then
    bash scripts/db.sh start
    set -a; . .data/postgres.env; set +a
  fi
  local flag=
  if [ "$1" = test ]; then
    export DATABASE_URL=${TEST_DATABASE_URL:-$DATABASE_URL}
    flag=--test
  fi
  # Object storage before the seed: the demo's micrograph is stored there.
  if [ "$1" = test ]; then start_s3 always; else start_s3; fi
  npx tsx scripts/migrate.ts $flag
  npx tsx scripts/seed.ts $flag
}

# The local fake SMTP server, unless SMTP_URL points at a real one (`start_smtp always` ignores SMTP_URL).
start_smtp() {
  if [ "${1:-}" = always ] || [ -z "${SMTP_URL:-}" ]; then
    SMTP_URL= bash scripts/smtp.sh start
    set -a; . .data/smtp.env; set +a
  fi
}

# The local fake S3 (object storage for uploads), unless DW_S3_ENDPOINT points at a real one (`start_s3 always`
# ignores it).
start_s3() {
  if [ "${1:-}" = always ] || [ -z "${DW_S3_ENDPOINT:-}" ]; then
    DW_S3_ENDPOINT= bash scripts/s3.sh start
    set -a; . .data/s3.env; set +a
  fi
}

build_app() {
  mkdir -p .data
  echo "[build] nuxt build" >&2
  npx nuxt build > .data/build.log 2>&1 || { tail -40 .data/build.log >&2; exit 1; }
}
