#!/usr/bin/env bash
# Starts a throw-away single-node Slurm on this machine (Debian's slurm-wlm and munge; this host is
# controller and compute node), runs submit.sh through it, waits for the merge, and stops the
# daemons again. For CI and for trying the Slurm scripts without a cluster; needs root.
#
#   workflows/slurm/ci_single_node.sh [submit.sh options] -- MATRIX --outcome COL [screen options...]
#   workflows/slurm/ci_single_node.sh --run PROGRAM [ARGUMENTS...]
#
# The first form runs `submit.sh --wait ...`; the second runs any program while Slurm is up, with
# SLURM_CONF pointing at it (e.g. snakemake with the profile in workflows/snakemake/profiles/slurm).
# Exit status: submit.sh's or the program's (0 when every job succeeded), or 3 when Slurm could not
# be started. The daemons' files live in a temporary folder printed at the start (kept on failure).
set -euo pipefail

here=$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)
started=$(date +%s)
say() { echo "ci_single_node: $(( $(date +%s) - started ))s: $*"; }

if [ "$(id -u)" -ne 0 ]; then
  echo "ci_single_node: needs root (it starts munged, slurmctld and slurmd)" >&2
  exit 3
fi
if ! command -v slurmctld >/dev/null 2>&1 || ! command -v munged >/dev/null 2>&1; then
  say "installing slurm-wlm and munge"
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq >/dev/null 2>&1 || true
  apt-get install -y -qq --no-install-recommends slurm-wlm munge >/dev/null 2>&1 || {
    echo "ci_single_node: could not install slurm-wlm and munge" >&2; exit 3; }
fi

state=$(mktemp -d /tmp/omicsscreen-slurm.XXXXXX)
chmod 755 "$state"
say "daemon files in ${state}"
munge_pid=""
stop_daemons() {
  # Only the daemons this script started, by the process ids they recorded; then wait (up to 10 s
  # each) until they are gone, so their folders can be removed.
  local pid_file pid
  for pid_file in "$state/slurmd.pid" "$state/slurmctld.pid" "$state/munged.pid"; do
    [ -s "$pid_file" ] || continue
    pid=$(cat "$pid_file")
    kill "$pid" 2>/dev/null || continue
    for _ in $(seq 1 100); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
  done
}
trap stop_daemons EXIT

# munge: its own key, socket and pid file, so a munged already running is left alone.
mkdir -p "$state/munge"
chown munge:munge "$state/munge"
chmod 755 "$state/munge"  # clients need to reach the socket
if [ ! -s /etc/munge/munge.key ]; then
  mungekey --create --keyfile=/etc/munge/munge.key
  chown munge:munge /etc/munge/munge.key
fi
runuser -u munge -- munged --socket="$state/munge/munge.socket" --pid-file="$state/munge/munged.pid" \
  --log-file="$state/munge/munged.log" --seed-file="$state/munge/munged.seed"
cp "$state/munge/munged.pid" "$state/munged.pid"

host=$(hostname -s)
node_line=$(slurmd -C | head -n 1)
mkdir -p "$state/ctld" "$state/d"
cat > "$state/slurm.conf" <<CONF
ClusterName=omicsscreen-ci
SlurmctldHost=${host}
SlurmUser=root
SlurmdUser=root
AuthType=auth/munge
AuthInfo=socket=${state}/munge/munge.socket
CredType=cred/munge
StateSaveLocation=${state}/ctld
SlurmdSpoolDir=${state}/d
SlurmctldPidFile=${state}/slurmctld.pid
SlurmdPidFile=${state}/slurmd.pid
SlurmctldLogFile=${state}/slurmctld.log
SlurmdLogFile=${state}/slurmd.log
SlurmctldPort=16817
SlurmdPort=16818
ProctrackType=proctrack/linuxproc
TaskPlugin=task/none
JobAcctGatherType=jobacct_gather/none
AccountingStorageType=accounting_storage/none
SchedulerType=sched/backfill
SelectType=select/cons_tres
SelectTypeParameters=CR_Core
ReturnToService=2
MpiDefault=none
${node_line} State=UNKNOWN
PartitionName=ci Nodes=${host} Default=YES MaxTime=INFINITE State=UP
CONF
export SLURM_CONF="$state/slurm.conf"

slurmctld -i
slurmd
say "waiting for node ${host} to be idle"
for _ in $(seq 1 60); do
  if sinfo -h -N -o '%T' 2>/dev/null | grep -qx 'idle'; then break; fi
  sleep 1
done
if ! sinfo -h -N -o '%T' 2>/dev/null | grep -qx 'idle'; then
  echo "ci_single_node: the node did not become idle; see ${state}/*.log" >&2
  sinfo -N >&2 || true
  trap - EXIT; stop_daemons
  exit 3
fi
say "Slurm is up"

status=0
if [ "${1:-}" = "--run" ]; then
  shift
  "$@" || status=$?
  say "${1:-the program} finished with status ${status}"
else
  "$here/submit.sh" --wait "$@" || status=$?
  say "submit.sh finished with status ${status}"
fi
say "$(squeue -h 2>/dev/null | wc -l) jobs left in the queue"
if [ "$status" -eq 0 ]; then
  stop_daemons
  trap - EXIT
  rm -rf "$state"
else
  echo "ci_single_node: kept ${state} for its logs" >&2
fi
exit "$status"
