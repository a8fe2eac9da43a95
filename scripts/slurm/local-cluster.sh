#!/usr/bin/env bash
# Start or stop a one-node Slurm cluster on localhost, for the integration test and for trying the
# job-array scripts on a workstation. Needs Debian's slurm-wlm and munge, and root.
#   scripts/slurm/local-cluster.sh start    # munge key, slurm.conf from nproc and memory, daemons, wait for idle
#   scripts/slurm/local-cluster.sh stop
#   scripts/slurm/local-cluster.sh status
set -euo pipefail
state=${LIGHTFOLD_SLURM_DIR:-/var/tmp/lightfold-slurm}
conf=/etc/slurm/slurm.conf
node=$(hostname -s)

start() {
  command -v slurmctld >/dev/null || { echo "slurmctld not found: apt-get install slurm-wlm munge" >&2; exit 2; }
  mkdir -p "$state"/{state,spool,log} /etc/slurm /run/munge /var/log/munge /var/lib/munge
  if [ ! -s /etc/munge/munge.key ]; then
    mkdir -p /etc/munge
    if command -v mungekey >/dev/null; then mungekey --create --keyfile=/etc/munge/munge.key --force; else create-munge-key -f; fi
  fi
  chown -R munge:munge /etc/munge /run/munge /var/log/munge /var/lib/munge
  chmod 0700 /etc/munge; chmod 0400 /etc/munge/munge.key
  pgrep -x munged >/dev/null || runuser -u munge -- munged
  cpus=$(nproc)
  mem=$(( $(awk '/MemTotal/ {print $2}' /proc/meminfo) / 1024 - 512 ))
  cat > "$conf" <<CONF
ClusterName=lightfold
SlurmctldHost=localhost
AuthType=auth/munge
SlurmUser=root
ProctrackType=proctrack/linuxproc
TaskPlugin=task/none
JobAcctGatherType=jobacct_gather/none
MpiDefault=none
ReturnToService=2
SchedulerType=sched/backfill
SelectType=select/cons_tres
SelectTypeParameters=CR_Core
SlurmctldPidFile=$state/slurmctld.pid
SlurmdPidFile=$state/slurmd.pid
SlurmdSpoolDir=$state/spool
StateSaveLocation=$state/state
SlurmctldLogFile=$state/log/slurmctld.log
SlurmdLogFile=$state/log/slurmd.log
NodeName=$node NodeAddr=127.0.0.1 CPUs=$cpus RealMemory=$mem State=UNKNOWN
PartitionName=local Nodes=$node Default=YES MaxTime=INFINITE State=UP
CONF
  pgrep -x slurmctld >/dev/null || slurmctld
  pgrep -x slurmd >/dev/null || slurmd -N "$node"
  for _ in $(seq 1 60); do
    s=$(sinfo -h -o %T 2>/dev/null | head -n1 || true)
    case "$s" in idle|mixed|allocated) echo "slurm: node $node is $s ($cpus CPUs, ${mem} MB)"; return 0;; esac
    scontrol update nodename="$node" state=resume >/dev/null 2>&1 || true
    sleep 1
  done
  echo "slurm: node did not become idle; see $state/log" >&2
  exit 1
}

stop() {
  scancel --user=root >/dev/null 2>&1 || true
  pkill -x slurmd 2>/dev/null || true
  pkill -x slurmctld 2>/dev/null || true
  echo "slurm: stopped"
}

case "${1:-start}" in
  start) start ;;
  stop) stop ;;
  status) sinfo ;;
  *) echo "usage: $0 start|stop|status" >&2; exit 2 ;;
esac
