#!/usr/bin/env bash
# Submits an OmicsScreen screen to Slurm as a job array of N parts plus one merge job that starts
# only when every part succeeded (--dependency=afterok:<array job id>).
#
#   workflows/slurm/submit.sh [submit options] -- MATRIX --outcome COL [screen options...]
#
# Submit options:
#   --parts N          parts (array tasks) to split the screen into (default 4)
#   --out DIR          merged results folder (default results)
#   --parts-dir DIR    where the part folders go (default <out>.parts)
#   --logs DIR         where Slurm writes each job's output (default <out>.logs)
#   --cpus N           CPUs per part, passed on as --threads (default 4)
#   --merge-cpus N     CPUs of the merge job (default 2)
#   --mem SIZE         memory per part and for the merge, e.g. 8G (default: the scripts' 4G)
#   --time LIMIT       wall time per part, e.g. 02:00:00 (default: the script's 2 hours)
#   --sbatch ARG       one more sbatch argument for both jobs, e.g. --sbatch --partition=short
#   --wait             return only when the merge job has ended (exit status: the merge's)
# Screen options must not hold --part, --out or --threads. The jobs run in the current folder, so
# relative paths work as long as the nodes see this folder at the same path. Set OMICSSCREEN to
# the tool (see screen_parts.sbatch); it is passed to the jobs with the rest of the environment.
set -euo pipefail

here=$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)
# The help text is the comment block at the top of this file.
help_text() { awk 'NR == 1 { next } /^#/ { sub(/^# ?/, ""); print; next } { exit }' "${BASH_SOURCE[0]}"; }
usage() { help_text >&2; exit 2; }

part_count=4
results=results
parts_dir=""
logs_dir=""
cpus=4
merge_cpus=2
mem=""
time_limit=""
wait_for_merge=false
extra=()
while [ "$#" -gt 0 ]; do
  case "$1" in
    --parts) part_count=${2:?--parts needs a number}; shift 2 ;;
    --out) results=${2:?--out needs a folder}; shift 2 ;;
    --parts-dir) parts_dir=${2:?--parts-dir needs a folder}; shift 2 ;;
    --logs) logs_dir=${2:?--logs needs a folder}; shift 2 ;;
    --cpus) cpus=${2:?--cpus needs a number}; shift 2 ;;
    --merge-cpus) merge_cpus=${2:?--merge-cpus needs a number}; shift 2 ;;
    --mem) mem=${2:?--mem needs a size}; shift 2 ;;
    --time) time_limit=${2:?--time needs a limit}; shift 2 ;;
    --sbatch) extra+=("${2:?--sbatch needs an argument}"); shift 2 ;;
    --wait) wait_for_merge=true; shift ;;
    --) shift; break ;;
    -h|--help) help_text; exit 0 ;;
    *) echo "submit.sh: unknown option '$1' (screen options go after --)" >&2; usage ;;
  esac
done
[ "$#" -ge 1 ] || { echo "submit.sh: give the screen's MATRIX and options after --" >&2; usage; }
[[ "$part_count" =~ ^[1-9][0-9]*$ ]] || { echo "submit.sh: --parts must be a positive whole number" >&2; exit 2; }
for word in "$@"; do
  case "$word" in
    --part|--part=*|--out|--out=*|--threads|--threads=*)
      echo "submit.sh: the screen options must not hold ${word%%=*}; the jobs set it" >&2; exit 2 ;;
  esac
done

results=${results%/}
parts_dir=${parts_dir:-${results}.parts}
logs_dir=${logs_dir:-${results}.logs}
mkdir -p "$parts_dir" "$logs_dir"

common=(--parsable --chdir="$PWD" --export=ALL)
[ -n "$mem" ] && common+=(--mem="$mem")
common+=(${extra[@]+"${extra[@]}"})

part_options=(--array="1-${part_count}" --cpus-per-task="$cpus"
  --output="${logs_dir}/part-%a-of-${part_count}.%A.out")
[ -n "$time_limit" ] && part_options+=(--time="$time_limit")

array_job=$(sbatch "${common[@]}" "${part_options[@]}" "$here/screen_parts.sbatch" \
  "$part_count" "$parts_dir" "$@")
array_job=${array_job%%;*}
echo "submitted parts 1-${part_count}: array job ${array_job}"

merge_options=(--dependency="afterok:${array_job}" --kill-on-invalid-dep=yes
  --cpus-per-task="$merge_cpus" --output="${logs_dir}/merge.%j.out")
$wait_for_merge && merge_options+=(--wait)
wait_status=0
merge_job=$(sbatch "${common[@]}" "${merge_options[@]}" "$here/merge.sbatch" \
  "$part_count" "$parts_dir" "$results") || wait_status=$?
merge_job=${merge_job%%;*}
if ! $wait_for_merge; then
  [ "$wait_status" -eq 0 ] || exit "$wait_status"
  echo "submitted merge: job ${merge_job} (starts when array job ${array_job} succeeded) -> ${results}"
  exit 0
fi

# sbatch --wait returns 0 for a job cancelled because a part failed, so ask Slurm how the merge
# ended: scontrol while the controller still holds the job, else the accounting database.
merge_state=$(scontrol show job -o "$merge_job" 2>/dev/null | grep -o 'JobState=[A-Z_]*' | cut -d= -f2 || true)
if [ -z "$merge_state" ] && command -v sacct >/dev/null 2>&1; then
  merge_state=$(sacct -n -X -P -j "$merge_job" -o State 2>/dev/null | head -n 1 | cut -d' ' -f1 || true)
fi
if [ "$wait_status" -ne 0 ] || [ "$merge_state" != COMPLETED ]; then
  echo "submit.sh: merge job ${merge_job} ended as ${merge_state:-unknown} (sbatch status ${wait_status});" \
    "see the logs in ${logs_dir}" >&2
  exit 1
fi
echo "merge job ${merge_job} completed -> ${results}"
