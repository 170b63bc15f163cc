#!/usr/bin/env bash
# Imitates the user CI recipes (ci/recipes/gitlab-ci.yml and github-actions.yml) locally: reads
# each pipeline file, runs the shell steps of the shard and report jobs as the CI system would
# (GitLab: `parallel` with CI_NODE_INDEX/CI_NODE_TOTAL; GitHub: the shard matrix with
# ${{ matrix.shard }} / ${{ strategy.job-total }}, the Actions cache as the baseline store),
# on a copy of the demo as the grammar repository. Pipeline 1 (main, grammar v1) must pass and
# leave a baseline; pipeline 2 (grammar v2, against that baseline) must fail the gate. The
# merged shards must give the same summary as one unsharded run. Installation steps are skipped:
# the built binary on PATH stands in for the installed package (package_deb.sh tests that).
set -euo pipefail
: "${TREEGATE:?}" "${SOURCE_DIR:?}"
for sub in run merge report; do
  if ! "$TREEGATE" "$sub" --help >/dev/null 2>&1; then
    echo "not run: subcommand $sub not built yet"
    exit 0
  fi
done
# Until the HTML report is built, the recipes' `--html FILE` argument is left out (and said so).
html=1
"$TREEGATE" report --help 2>/dev/null | grep -q -- "--html" || html=0
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
mkdir -p "$tmp/bin"
printf '#!/bin/sh\nexec "%s" "$@"\n' "$TREEGATE" >"$tmp/bin/treegate"
# GitLab's job-artifacts API imitated: serves $FAKE_BASELINE when it exists, else HTTP 404 (22).
cat >"$tmp/bin/curl" <<'SH'
#!/bin/sh
out=""
while [ $# -gt 0 ]; do
  case "$1" in -o) out=$2; shift ;; esac
  shift
done
[ -n "${FAKE_BASELINE:-}" ] && [ -f "$FAKE_BASELINE" ] && cp "$FAKE_BASELINE" "$out" && exit 0
echo "curl: (22) The requested URL returned error: 404" >&2
exit 22
SH
chmod +x "$tmp/bin/treegate" "$tmp/bin/curl"
xsd="${TREEGATE_SHARED:-$SOURCE_DIR/../shared}/reference/junit/junit-10.xsd"

export PATH="$tmp/bin:$PATH" RECIPES="$SOURCE_DIR/ci/recipes" DEMO="$SOURCE_DIR/suites/demo" \
  WORK="$tmp" XSD="$xsd" HTML="$html"
exec /usr/bin/python3 - <<'PY'
import json, os, re, shutil, subprocess, sys
import yaml

work, demo, recipes, xsd = (os.environ[k] for k in ("WORK", "DEMO", "RECIPES", "XSD"))
failures = []
html = os.environ["HTML"] == "1"
if not html:
    print("note: report --html not built yet: the recipes' --html argument is left out")

def check(cond, what):
    print(("ok   " if cond else "FAIL ") + what)
    if not cond:
        failures.append(what)

def fresh_repo(name, grammar):
    repo = os.path.join(work, name)
    shutil.copytree(demo, repo)
    with open(os.path.join(repo, "treegate.yaml"), encoding="utf-8") as f:
        text = f.read()
    text, n = re.subn(r"(?m)^grammar: .*$", f"grammar: {grammar}", text)
    assert n == 1, "treegate.yaml has no grammar line"
    with open(os.path.join(repo, "treegate.yaml"), "w", encoding="utf-8") as f:
        f.write(text)
    return repo

def sh(script, cwd, env):
    if not html:
        script = re.sub(r'--html\s+"[^"]*"\s*', "", script)
    full = dict(os.environ, **{k: str(v) for k, v in env.items()})
    r = subprocess.run(["bash", "--noprofile", "--norc", "-eo", "pipefail", "-c", script],
                       cwd=cwd, env=full, capture_output=True, text=True)
    if r.returncode != 0:
        sys.stdout.write("  (exit %d; last output lines:)\n" % r.returncode + "\n".join((r.stdout + r.stderr).splitlines()[-4:]) + "\n")
    return r.returncode

def summary(path):
    with open(path, encoding="utf-8") as f:
        s = json.load(f)
    return {k: s[k] for k in ("cases", "passed", "failed", "errors", "expected_failures")}, s

def check_reports(out, label):
    for name in ("results.jsonl", "junit.xml", "summary.json") + (("report.html",) if html else ()):
        check(os.path.isfile(os.path.join(out, name)), f"{label}: {name} written")
    if os.path.isfile(xsd) and os.path.isfile(os.path.join(out, "junit.xml")):
        r = subprocess.run(["xmllint", "--noout", "--schema", xsd, os.path.join(out, "junit.xml")],
                           capture_output=True, text=True)
        check(r.returncode == 0, f"{label}: junit.xml valid against junit-10.xsd")

# The reference: one unsharded run per grammar.
reference = {}
for grammar in ("v1.pcfg", "v2.pcfg"):
    repo = fresh_repo(f"ref-{grammar}", grammar)
    code = subprocess.run(["treegate", "run", "--summary-json", "ref.json", "--results", "ref.jsonl"],
                          cwd=repo, capture_output=True, text=True).returncode
    check(code in (0, 1), f"unsharded run with {grammar} exits 0 or 1 (got {code})")
    reference[grammar] = summary(os.path.join(repo, "ref.json"))[0]
print("reference summaries:", reference)

# ---- GitLab CI ------------------------------------------------------------------------------
with open(os.path.join(recipes, "gitlab-ci.yml"), encoding="utf-8") as f:
    gl = yaml.safe_load(f)
shard_job, report_job = gl["treegate-shard"], gl["treegate-report"]
nodes = int(shard_job["parallel"])
base_env = dict(gl.get("variables", {}), CI_JOB_TOKEN="x", CI_API_V4_URL="https://gitlab.invalid/api/v4",
                CI_PROJECT_ID="7", CI_DEFAULT_BRANCH="main")

def gitlab_pipeline(name, grammar, baseline):
    repo = fresh_repo(name, grammar)
    env = dict(base_env, FAKE_BASELINE=baseline or "")
    for k in range(1, nodes + 1):
        code = sh("\n".join(shard_job["script"]), repo, dict(env, CI_NODE_INDEX=k, CI_NODE_TOTAL=nodes))
        check(code == 0, f"gitlab {name}: shard {k}/{nodes} job succeeds")
    code = sh("\n".join(report_job["script"]), repo, env)
    return repo, code

repo1, code = gitlab_pipeline("gitlab-main-v1", "v1.pcfg", None)
out1 = os.path.join(repo1, "treegate-out")
check(code == 0, f"gitlab pipeline 1 (v1, no baseline): report job passes (exit {code})")
check_reports(out1, "gitlab pipeline 1")
merged, _ = summary(os.path.join(out1, "summary.json"))
check(merged == reference["v1.pcfg"], f"gitlab: merged shards {merged} == unsharded run")

repo2, code = gitlab_pipeline("gitlab-mr-v2", "v2.pcfg", os.path.join(out1, "results.jsonl"))
out2 = os.path.join(repo2, "treegate-out")
check(code != 0, f"gitlab pipeline 2 (v2 against the v1 baseline): report job fails the gate (exit {code})")
check_reports(out2, "gitlab pipeline 2")
merged, s2 = summary(os.path.join(out2, "summary.json"))
check(merged == reference["v2.pcfg"], "gitlab: merged v2 shards == unsharded v2 run")
check(s2["gate"]["passed"] is False and len(s2["regressions"]) > 0 and len(s2["fixes"]) > 0,
      f"gitlab pipeline 2: summary shows the gate failed with {len(s2['regressions'])} regressions, {len(s2['fixes'])} fixes")

# ---- GitHub Actions -------------------------------------------------------------------------
with open(os.path.join(recipes, "github-actions.yml"), encoding="utf-8") as f:
    gh = yaml.safe_load(f)
cache = os.path.join(work, "actions-cache")

def expand(text, ctx):
    def sub(m):
        key = m.group(1).strip()
        if key not in ctx:
            raise KeyError(f"expression not imitated: {key}")
        return str(ctx[key])
    return re.sub(r"\$\{\{(.*?)\}\}", sub, text)

def condition(step, ctx):
    cond = step.get("if")
    if cond is None or cond == "always()":
        return True
    m = re.fullmatch(r"github\.ref == '([^']*)'", cond.strip())
    if not m:
        raise ValueError(f"condition not imitated: {cond}")
    return ctx["github.ref"] == m.group(1)

def github_job(job, repo, ctx):
    """Runs a job's steps; returns the exit status of the first failing run step (0: none)."""
    failed = 0
    env = dict(gh.get("env", {}))
    for step in job["steps"]:
        if failed and step.get("if") != "always()":
            continue
        if not condition(step, ctx):
            continue
        uses = step.get("uses", "")
        if uses.startswith("actions/cache/restore"):
            if os.path.isdir(cache):
                shutil.copytree(cache, os.path.join(repo, step["with"]["path"]), dirs_exist_ok=True)
        elif uses.startswith("actions/cache/save"):
            shutil.copytree(os.path.join(repo, step["with"]["path"]), cache, dirs_exist_ok=True)
        elif uses:
            continue  # checkout / artifacts: one shared folder stands in for them
        elif "apt-get" in step["run"]:
            continue  # installation: the built binary on PATH stands in for the package
        else:
            code = sh(expand(step["run"], ctx), repo, env)
            failed = failed or code
    return failed

shards = gh["jobs"]["shard"]["strategy"]["matrix"]["shard"]

def github_workflow(name, grammar, ref):
    repo = fresh_repo(name, grammar)
    ctx = {"strategy.job-total": len(shards), "github.ref": ref, "github.sha": name,
           "env.TREEGATE_OUT": gh["env"]["TREEGATE_OUT"]}
    for k in shards:
        code = github_job(gh["jobs"]["shard"], repo, dict(ctx, **{"matrix.shard": k}))
        check(code == 0, f"github {name}: shard {k}/{len(shards)} job succeeds")
    return repo, github_job(gh["jobs"]["report"], repo, ctx)

repo1, code = github_workflow("github-main-v1", "v1.pcfg", "refs/heads/main")
check(code == 0, f"github push to main (v1): report job passes (exit {code})")
check_reports(os.path.join(repo1, "treegate-out"), "github main")
check(os.path.isfile(os.path.join(cache, "results.jsonl")), "github: main run saved its results in the cache")
repo2, code = github_workflow("github-pr-v2", "v2.pcfg", "refs/pull/1/merge")
check(code != 0, f"github pull request (v2, cached main baseline): report job fails the gate (exit {code})")
_, s2 = summary(os.path.join(repo2, "treegate-out", "summary.json"))
check(s2["gate"]["passed"] is False and len(s2["regressions"]) > 0,
      "github pull request: summary names the regressions against the main baseline")
with open(os.path.join(cache, "results.jsonl"), encoding="utf-8") as f, \
     open(os.path.join(repo1, "treegate-out", "results.jsonl"), encoding="utf-8") as g:
    check(f.read() == g.read(), "github: a pull request does not overwrite the main baseline")

print(f"{len(failures)} failures")
sys.exit(1 if failures else 0)
PY
