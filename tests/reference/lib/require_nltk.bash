# Sourced by the reference checks: sets py to Debian's python3 and makes sure it has nltk.
# Without nltk the check fails under CI and prints a "not run" line otherwise.
py=/usr/bin/python3
if ! $py -c 'import nltk' 2>/dev/null; then
  if [ -n "${CI:-}" ]; then echo "python3-nltk is missing (ci/install-deps installs it)"; exit 1; fi
  echo "not run: /usr/bin/python3 has no nltk (run ci/install-deps)"; exit 0
fi
