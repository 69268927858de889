#!/usr/bin/env bash
# A one-node Slurm cluster on this machine, for the sharded-ingest test and for trying the job scripts.
#
#   tools/slurm/local-cluster.sh start DIR   # DIR must not exist; prints "export SLURM_CONF=DIR/slurm.conf"
#   tools/slurm/local-cluster.sh stop DIR    # cancels the cluster's jobs, stops the daemons started in DIR
#
# start: writes DIR/slurm.conf from local-cluster/slurm.conf.in (this host's name, free ports, CPUs, user),
# generates a munge key into DIR/munge, starts munged, slurmctld and slurmd in the foreground of background
# shells, records each "name pid" in DIR/pids and waits until the node is idle. Nothing in /etc is read or changed.
# stop: sends TERM to exactly the recorded PIDs (only while /proc/PID still names the same program), waits,
# then KILL. Needs the Debian packages munge, slurmctld, slurmd and slurm-client. The daemons run as the
# calling user (SlurmUser = SlurmdUser = you); jobs can then run only as that user, which is all a test needs.
set -euo pipefail

here="$(cd "$(dirname "$0")" && pwd)"
usage() { echo "usage: $0 start|stop DIR" >&2; exit 2; }
[ $# -eq 2 ] || usage
action="$1"
dir="$2"

log() { echo "local-cluster: $*" >&2; }

port_is_free() {
  # A connect that fails means nobody listens there.
  ! (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null
}

free_port() {
  local p tries=0
  while [ $tries -lt 200 ]; do
    p=$(( 20000 + (RANDOM * 32768 + RANDOM) % 40000 ))
    if port_is_free "$p" && [ "$p" != "${1:-}" ]; then echo "$p"; return 0; fi
    tries=$((tries + 1))
  done
  log "no free TCP port found on 127.0.0.1 after 200 tries"; return 1
}

record() { echo "$1 $2" >> "$dir/pids"; }

wait_until() {
  # wait_until SECONDS WHAT PID COMMAND...: polls every 0.5 s; gives up at once if the daemon PID has exited.
  local limit=$(( $1 * 2 )) what="$2" pid="$3" i=0; shift 3
  until "$@" >/dev/null 2>&1; do
    if [ ! -d "/proc/$pid" ]; then log "$what: the daemon (PID $pid) exited; see $dir/log/"; return 1; fi
    i=$((i + 1))
    if [ $i -ge $limit ]; then log "$what did not happen within $((limit / 2)) s"; return 1; fi
    sleep 0.5
  done
}

node_idle() {
  local state
  state="$(sinfo -h -N -o %t 2>/dev/null | head -n 1)"
  [ "$state" = "idle" ] || [ "$state" = "mix" ] || [ "$state" = "alloc" ]
}

start() {
  for cmd in munged mungekey slurmctld slurmd sbatch sinfo scontrol; do
    command -v "$cmd" >/dev/null || { log "$cmd not found: install the Debian packages munge slurmctld slurmd slurm-client (tools/install-test-deps.sh munge slurmctld slurmd slurm-client)"; exit 1; }
  done
  [ ! -e "$dir" ] || { log "$dir already exists: give a new folder"; exit 2; }
  mkdir -p "$dir"
  dir="$(cd "$dir" && pwd)"
  mkdir -p "$dir/munge" "$dir/state" "$dir/spool" "$dir/log" "$dir/run"
  chmod 700 "$dir" "$dir/munge"
  : > "$dir/pids"
  # A start that fails half-way stops the daemons it did start.
  trap 'if [ "${up:-0}" != 1 ]; then log "start failed: stopping what was started"; stop; fi' EXIT

  local host user cpus ctld_port slurmd_port
  host="$(hostname -s)"
  user="$(id -un)"
  cpus="$(nproc)"
  ctld_port="$(free_port)"
  slurmd_port="$(free_port "$ctld_port")"
  sed -e "s|@HOST@|$host|g" -e "s|@USER@|$user|g" -e "s|@CPUS@|$cpus|g" -e "s|@DIR@|$dir|g" \
      -e "s|@CTLD_PORT@|$ctld_port|g" -e "s|@SLURMD_PORT@|$slurmd_port|g" \
      "$here/local-cluster/slurm.conf.in" > "$dir/slurm.conf"
  export SLURM_CONF="$dir/slurm.conf"

  mungekey --create --keyfile="$dir/munge/munge.key" --bits=1024
  chmod 400 "$dir/munge/munge.key"
  munged --foreground --force --key-file="$dir/munge/munge.key" --socket="$dir/munge/munge.socket" \
         --pid-file="$dir/run/munged.pid" --log-file="$dir/log/munged.log" --seed-file="$dir/munge/munged.seed" \
         </dev/null >"$dir/log/munged.out" 2>&1 &
  record munged $!
  wait_until 20 "munged socket" $! test -S "$dir/munge/munge.socket"

  slurmctld -D -f "$dir/slurm.conf" </dev/null >"$dir/log/slurmctld.out" 2>&1 &
  record slurmctld $!
  wait_until 90 "slurmctld answering" $! scontrol ping

  slurmd -D -N "$host" -f "$dir/slurm.conf" </dev/null >"$dir/log/slurmd.out" 2>&1 &
  record slurmd $!
  if ! wait_until 120 "node $host idle" $! node_idle; then
    tail -n 20 "$dir/log/slurmctld.log" "$dir/log/slurmd.log" "$dir/log/slurmd.out" >&2 || true
    exit 1
  fi
  up=1
  log "cluster up: node $host, $cpus CPUs, slurmctld on port $ctld_port, slurmd on $slurmd_port"
  echo "export SLURM_CONF=$dir/slurm.conf"
}

stop() {
  [ -f "$dir/pids" ] || { log "$dir/pids not found: nothing was started there"; exit 0; }
  export SLURM_CONF="$dir/slurm.conf"
  if [ -f "$SLURM_CONF" ]; then
    scancel --quiet --user="$(id -un)" >/dev/null 2>&1 || true
  fi
  local name pid pids=()
  # Newest first: slurmd, slurmctld, then munged (the others talk to it while shutting down).
  while read -r name pid; do
    if [ -r "/proc/$pid/cmdline" ] && tr '\0' ' ' < "/proc/$pid/cmdline" | grep -q "$name"; then
      pids=("$pid" "${pids[@]}")
    fi
  done < "$dir/pids"
  for pid in "${pids[@]}"; do kill -TERM "$pid" 2>/dev/null || true; done
  local i=0 alive
  while [ $i -lt 30 ]; do
    alive=()
    for pid in "${pids[@]}"; do [ -d "/proc/$pid" ] && alive+=("$pid"); done
    [ ${#alive[@]} -eq 0 ] && break
    sleep 0.5; i=$((i + 1))
  done
  for pid in "${pids[@]}"; do
    if [ -d "/proc/$pid" ]; then log "PID $pid did not stop on TERM within 15 s: KILL"; kill -KILL "$pid" 2>/dev/null || true; fi
  done
  : > "$dir/pids"
}

case "$action" in
  start) start ;;
  stop) stop ;;
  *) usage ;;
esac
