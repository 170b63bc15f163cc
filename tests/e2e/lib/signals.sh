# Sourced by e2e scripts that interrupt a run. A shell starts background jobs with SIGINT
# ignored, so a SIGINT sent before treegate has installed its handler would be lost and the
# run would finish normally: wait until the handler is there (SigCgt in /proc) first.
# wait_for_handler PID SIGNUM: returns 1 when PID ends or 10 s pass without it.
wait_for_handler() {
  local pid=$1 sig=$2 mask i
  for ((i = 0; i < 1000; i++)); do
    mask=$(sed -n 's/^SigCgt:\s*//p' "/proc/$pid/status" 2>/dev/null) || return 1
    [ -n "$mask" ] || return 1
    if (((16#$mask >> (sig - 1)) & 1)); then return 0; fi
    sleep 0.01
  done
  return 1
}
