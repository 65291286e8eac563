#!/usr/bin/env bash
# Opt-in check (not part of the default test run): brings up a single-node Slurm from the distribution's
# packages, runs the job-array recipe of docs/sweeps.md, cancels one task and reruns it, merges the
# shards and compares the merged result with a one-machine sweep, file by file.
#
#   sudo bash tests/slurm/run-recipe.sh            # Debian/Ubuntu; installs slurm-wlm and munge
#
# Needs root (it installs packages, writes /etc/slurm and starts munged, slurmctld and slurmd) and the
# .NET 10 SDK. It stops the daemons it started when it ends. Work folder: $MPPT_SLURM_WORK or a fresh
# temporary folder. Exit 0 only when the merged sweep equals the one-machine sweep.
set -euo pipefail
ROOT="$(cd "$(dirname "$0")/../.." && pwd)"
WORK="${MPPT_SLURM_WORK:-$(mktemp -d /tmp/mppt-slurm.XXXXXX)}"
N=4
say() { echo "slurm-recipe: $*"; }

if ! command -v sbatch >/dev/null || ! command -v munged >/dev/null; then
  say "installing slurm-wlm and munge"
  DEBIAN_FRONTEND=noninteractive apt-get update -q >/dev/null
  DEBIAN_FRONTEND=noninteractive apt-get install -y -q slurm-wlm munge >/dev/null
fi

host="$(hostname -s)"
cpus="$(nproc)"
mem_mb=$(( $(awk '/MemTotal/ {print $2}' /proc/meminfo) / 1024 - 512 ))
mkdir -p /etc/slurm /var/spool/slurmctld /var/spool/slurmd /var/log/slurm /run/munge
cat > /etc/slurm/slurm.conf <<CONF
ClusterName=mppt-check
SlurmctldHost=$host
SlurmUser=root
AuthType=auth/munge
StateSaveLocation=/var/spool/slurmctld
SlurmdSpoolDir=/var/spool/slurmd
SlurmctldLogFile=/var/log/slurm/slurmctld.log
SlurmdLogFile=/var/log/slurm/slurmd.log
ProctrackType=proctrack/linuxproc
TaskPlugin=task/none
JobAcctGatherType=jobacct_gather/none
SelectType=select/cons_tres
SelectTypeParameters=CR_CPU
ReturnToService=2
MpiDefault=none
NodeName=$host CPUs=$cpus RealMemory=$mem_mb State=UNKNOWN
PartitionName=check Nodes=$host Default=YES MaxTime=INFINITE State=UP
CONF

started=()
cleanup() {
  for p in "${started[@]}"; do kill "$p" 2>/dev/null || true; done
}
trap cleanup EXIT

if ! pgrep -x munged >/dev/null; then
  [ -f /etc/munge/munge.key ] || { mkdir -p /etc/munge; dd if=/dev/urandom of=/etc/munge/munge.key bs=1024 count=1 status=none; }
  chown -R munge:munge /etc/munge /run/munge /var/lib/munge /var/log/munge 2>/dev/null || true
  chmod 400 /etc/munge/munge.key
  su -s /bin/sh munge -c "munged" || munged --force
  started+=("$(pgrep -x munged | head -1)")
fi
slurmctld -D >/dev/null 2>&1 & started+=($!)
slurmd -D >/dev/null 2>&1 & started+=($!)
for _ in $(seq 60); do sinfo -h -o %T 2>/dev/null | grep -q idle && break; sleep 1; done
sinfo -h -o "%P %T %c" | grep -q idle || { say "slurm did not come up; see /var/log/slurm"; exit 1; }
say "single-node Slurm up on $host ($cpus CPUs)"

# The recipe: build the tool once; the tasks run the built tool by absolute path.
say "publishing the tool into $WORK/tool"
dotnet publish "$ROOT/src/MpptArena.Cli" -c Release -o "$WORK/tool" -nologo -v quiet >/dev/null
TOOL="$WORK/tool/mppt-arena.dll"
SWEEP="$ROOT/scenarios/sweeps/tuning-demo.yaml"
cat > "$WORK/sweep.sh" <<JOB
#!/bin/bash
#SBATCH --job-name=mppt-sweep
#SBATCH --array=1-$N
#SBATCH --cpus-per-task=1
#SBATCH --output=$WORK/task-%a.log
dotnet "$TOOL" sweep "$SWEEP" --shard "\$SLURM_ARRAY_TASK_ID/$N" --threads "\$SLURM_CPUS_PER_TASK" \\
    --out "$WORK/shards/\$SLURM_ARRAY_TASK_ID" --quiet --no-plots
JOB

wait_job() { while squeue -h -j "$1" 2>/dev/null | grep -q .; do sleep 2; done; }

cd /   # submit from an unrelated folder: the recipe must not depend on it
job=$(sbatch --parsable "$WORK/sweep.sh")
scancel "${job}_2"
say "submitted array $job; cancelled task 2"
wait_job "$job"
if dotnet "$TOOL" merge "$WORK"/shards/* --out "$WORK/merged-early" >"$WORK/merge-early.log" 2>&1; then
  say "FAIL: merge accepted the shards with task 2 cancelled"; exit 1
fi
say "merge without task 2 refused: $(head -1 "$WORK/merge-early.log")"

rerun=$(sbatch --parsable --array=2 "$WORK/sweep.sh")
say "reran task 2 as job $rerun"
wait_job "$rerun"
merge=$(sbatch --parsable --dependency=afterany:"$rerun" --output="$WORK/merge.log" \
  --wrap "dotnet $TOOL merge $WORK/shards/* --out $WORK/merged")
wait_job "$merge"
[ -f "$WORK/merged/cases.csv" ] || { say "FAIL: merge job wrote nothing; $WORK/merge.log:"; cat "$WORK/merge.log"; exit 1; }

say "one-machine sweep for comparison"
dotnet "$TOOL" sweep "$SWEEP" --out "$WORK/single" --quiet --no-plots >/dev/null
# Every file the one-machine run writes must be in the merge, byte for byte, except the output marker
# (mppt-arena-output.json says which command wrote the folder: sweep or merge).
status=0
for f in $(cd "$WORK/single" && find . -type f ! -name '.*' ! -name mppt-arena-output.json | sort); do
  if ! cmp -s "$WORK/single/$f" "$WORK/merged/$f"; then say "FAIL: $f differs"; status=1; fi
done
[ $status -eq 0 ] && say "OK: merged shards equal the one-machine sweep ($(cd "$WORK/single" && find . -type f ! -name '.*' ! -name mppt-arena-output.json | wc -l) files); work folder $WORK"
exit $status
