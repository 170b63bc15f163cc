# Sourced by e2e scripts that interrupt a run. A shell starts background jobs with SIGINT
# ignored, so a SIGINT sent before treegate has installed its handler would be lost and the
# run would finish normally: wait until the handler is there (SigCgt in /proc) first. The
# forked shell child, before it executes treegate, shows the shell's own handlers in SigCgt
# (bash catches SIGINT), so the process must also be running $TREEGATE already.
# wait_for_handler PID SIGNUM: returns 1 when PID ends or 10 s pass without it.
wait_for_handler() {
  local pid=$1 sig=$2 mask exe i want
  want=$(readlink -f "$TREEGATE")
  for ((i = 0; i < 1000; i++)); do
    exe=$(readlink "/proc/$pid/exe" 2>/dev/null) || return 1
    mask=$(sed -n 's/^SigCgt:\s*//p' "/proc/$pid/status" 2>/dev/null) || return 1
    [ -n "$mask" ] || return 1
    if [ "$exe" = "$want" ] && (((16#$mask >> (sig - 1)) & 1)); then return 0; fi
    sleep 0.01
  done
  return 1
}
