#!/usr/bin/env bash
# Debian packages the tests use: chromium (browser tests) python3-ezdxf (independent DXF audit) and
# poppler-utils (pdftotext reads the fab sheet PDF back).
set -euo pipefail
missing=()
[ -x /usr/bin/chromium ] || missing+=(chromium)
/usr/bin/python3 -c 'import ezdxf' 2>/dev/null || missing+=(python3-ezdxf)
[ -x /usr/bin/pdftotext ] || missing+=(poppler-utils)
if [ ${#missing[@]} -gt 0 ]; then
  echo "[system] installing ${missing[*]} with apt-get" >&2
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq >/dev/null
  apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null
fi
