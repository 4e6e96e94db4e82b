#!/usr/bin/env bash
# Starts a one-node Slurm cluster on this machine from Debian's packages (slurm-wlm, munge), runs a
# job array of `sagitta fit --shard K/N` with sbatch --array, merges the parts with `sagitta merge`
# and compares the merged bytes with one unsharded run. Stops the daemons by their pid files.
#
#   test/slurm/one-node.sh <hits file> <field> <shards> [work folder]
#
# Needs root (slurmd runs jobs as their owner; munged and the daemons are started here, not by the
# system's service manager). All state, spool, logs, keys and sockets live in the work folder (a new
# temporary folder by default), so nothing of a real cluster is touched. Exit 0 when merged equals
# unsharded byte for byte; 1 when they differ; 2 when the cluster could not be started.
# Caution: this starts network daemons (on ports picked at random from 20000-29999); run it only on
# a test machine you control.
set -euo pipefail

hits="$(realpath "$1")"
field="$2"
shards="$3"
work="${4:-$(mktemp -d /tmp/sagitta-slurm-XXXXXX)}"
repo="$(cd "$(dirname "$0")/../.." && pwd)"
node="$(command -v node)"
mkdir -p "$work"/{state,spool,log,munge,parts}
chmod 700 "$work/munge"

die() { echo "one-node.sh: $*" >&2; exit 2; }
for cmd in munged slurmctld slurmd sbatch squeue scontrol sinfo; do
  command -v "$cmd" >/dev/null || die "$cmd not found (apt-get install slurm-wlm munge)"
done
[ "$(id -u)" = 0 ] || die "run as root (slurmd and munged are started by this script)"

stop() {
  for pidfile in "$work/slurmd.pid" "$work/slurmctld.pid" "$work/munge/munged.pid"; do
    if [ -s "$pidfile" ]; then
      pid="$(cat "$pidfile")"
      echo "$pid" >> "$work/stopped.pids"
      kill "$pid" 2>/dev/null || true
      for _ in $(seq 50); do kill -0 "$pid" 2>/dev/null || break; sleep 0.1; done
      kill -9 "$pid" 2>/dev/null || true
    fi
  done
}
trap stop EXIT

# munge: a fresh key of our own, its own socket, pid, seed and log files.
dd if=/dev/urandom of="$work/munge/munge.key" bs=1 count=1024 status=none
chmod 400 "$work/munge/munge.key"
socket="$work/munge/munge.socket"
munged --force --key-file="$work/munge/munge.key" --socket="$socket" --pid-file="$work/munge/munged.pid" \
  --seed-file="$work/munge/munged.seed" --log-file="$work/log/munged.log" || die "munged did not start (see $work/log/munged.log)"

host="$(hostname -s)"
cpus="$(nproc)"
port=$((20000 + RANDOM % 9998))
cat > "$work/slurm.conf" <<CONF
ClusterName=sagitta-one-node
SlurmctldHost=$host
SlurmctldPort=$port
SlurmdPort=$((port + 1))
SlurmUser=root
AuthType=auth/munge
AuthInfo=socket=$socket
CredType=cred/munge
ProctrackType=proctrack/linuxproc
TaskPlugin=task/none
SelectType=select/cons_tres
SelectTypeParameters=CR_CPU
SchedulerType=sched/backfill
MpiDefault=none
ReturnToService=2
JobCompType=jobcomp/none
JobAcctGatherType=jobacct_gather/none
AccountingStorageType=accounting_storage/none
StateSaveLocation=$work/state
SlurmdSpoolDir=$work/spool
SlurmctldPidFile=$work/slurmctld.pid
SlurmdPidFile=$work/slurmd.pid
SlurmctldLogFile=$work/log/slurmctld.log
SlurmdLogFile=$work/log/slurmd.log
NodeName=$host CPUs=$cpus State=UNKNOWN
PartitionName=one Nodes=$host Default=YES MaxTime=INFINITE State=UP
CONF
export SLURM_CONF="$work/slurm.conf"
slurmctld -f "$SLURM_CONF" || die "slurmctld did not start (see $work/log/slurmctld.log)"
slurmd -f "$SLURM_CONF" || die "slurmd did not start (see $work/log/slurmd.log)"
for _ in $(seq 100); do
  state="$(sinfo -h -N -o '%T' 2>/dev/null | head -1 || true)"
  case "$state" in idle*|mixed*|allocated*) break ;; esac
  sleep 0.2
done
case "$state" in idle*|mixed*|allocated*) ;; *) die "the node did not come up (state '$state'; see $work/log)" ;; esac

# The job array a user would write: one shard per task, one thread each.
cat > "$work/fit-shards.sbatch" <<JOB
#!/bin/bash
#SBATCH --job-name=sagitta-fit
#SBATCH --array=1-$shards
#SBATCH --cpus-per-task=1
#SBATCH --output=$work/log/fit-%A_%a.out
"$node" "$repo/kernel/bin/sagitta.js" fit "$hits" --field "$field" --threads 1 --quiet \\
  --shard "\$SLURM_ARRAY_TASK_ID/$shards" --out "$work/parts/part-\$SLURM_ARRAY_TASK_ID.csv"
JOB
job="$(sbatch --parsable --chdir="$work" "$work/fit-shards.sbatch")" || die "sbatch refused the job array"
job="${job%%;*}"
for _ in $(seq 1200); do
  [ -z "$(squeue -h -j "$job" 2>/dev/null || true)" ] && break
  sleep 0.5
done
[ -z "$(squeue -h -j "$job" 2>/dev/null || true)" ] || die "job array $job did not finish in 10 minutes"

parts=()
for k in $(seq "$shards"); do
  [ -s "$work/parts/part-$k.csv" ] || { echo "one-node.sh: part $k missing (see $work/log/fit-${job}_$k.out)" >&2; exit 1; }
  parts+=("$work/parts/part-$k.csv")
done
"$node" "$repo/kernel/bin/sagitta.js" merge "${parts[@]}" --out "$work/merged.csv"
"$node" "$repo/kernel/bin/sagitta.js" fit "$hits" --field "$field" --quiet --out "$work/whole.csv" 2>/dev/null
if cmp -s "$work/merged.csv" "$work/whole.csv"; then
  echo "one-node.sh: job $job, $shards shards on $host ($cpus CPUs): merged equals unsharded ($(wc -c < "$work/whole.csv") bytes)"
else
  echo "one-node.sh: merged $work/merged.csv differs from unsharded $work/whole.csv" >&2
  exit 1
fi
