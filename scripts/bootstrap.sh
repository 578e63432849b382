# Sourced by start.sh, test.sh and bench.sh: installs what a fresh Debian machine is missing.
# Debian packages only when running as root (else the exact command is printed); npm packages from the lock.

need_debian() { # need_debian <binary> <package>
  local bin="$1" pkg="$2"
  if command -v "$bin" >/dev/null 2>&1 || [ -x "/usr/sbin/$bin" ] || [ -x "/usr/bin/$bin" ]; then return 0; fi
  if [ "$(id -u)" -eq 0 ]; then
    echo "lumenyard: installing Debian package $pkg (for $bin)…"
    if [ -z "${LUMENYARD_APT_UPDATED:-}" ]; then
      apt-get update -qq || { echo "lumenyard: apt-get update failed" >&2; exit 1; }
      export LUMENYARD_APT_UPDATED=1
    fi
    DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "$pkg" >/dev/null \
      || { echo "lumenyard: could not install $pkg" >&2; exit 1; }
  else
    echo "lumenyard: $bin is missing. Install it with:" >&2
    echo "    sudo apt-get update && sudo apt-get install -y $pkg" >&2
    exit 1
  fi
}

need_node_modules() {
  if [ ! -d node_modules ] || [ ! -f node_modules/.package-lock.json ] || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    echo "lumenyard: installing npm packages (npm ci)…"
    npm ci --no-audit --no-fund --loglevel=error || { echo "lumenyard: npm ci failed" >&2; exit 1; }
  fi
}

# The embedded database is used unless LUMENYARD_DB_PASSWORD points the app at an existing server.
need_database_server() {
  if [ -z "${LUMENYARD_DB_PASSWORD:-}" ]; then
    need_debian mariadbd mariadb-server
    need_debian mariadb mariadb-client
  fi
}

TSX="node_modules/.bin/tsx --tsconfig tsconfig.server.json"
