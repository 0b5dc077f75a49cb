#!/bin/bash
# Feature stage of a patternfold study as a Slurm job array: task K of N computes part K/N
# of the (recording x cell) work into a cache folder that every node can reach. Afterwards,
# one `patternfold run` with the same --cache finds every feature cached.
#
#   sbatch --array=1-16 scripts/slurm/features-array.sh studies/cohort.yaml /shared/pf-cache
#   # when all tasks have finished (or chain it: sbatch --dependency=afterok:<jobid> ...):
#   patternfold run studies/cohort.yaml --cache /shared/pf-cache
#
# The number of parts is taken from the array (SLURM_ARRAY_TASK_COUNT), so change --array
# to change it. Tasks may run in any order, at the same time, or again after a failure:
# entries are content-addressed and written atomically, and a task skips what is cached.
#
#SBATCH --job-name=patternfold-features
#SBATCH --cpus-per-task=4
#SBATCH --mem=4G
#SBATCH --time=02:00:00
#SBATCH --output=patternfold-features-%A_%a.log

set -euo pipefail

STUDY="${1:?usage: sbatch --array=1-N features-array.sh STUDY.yaml CACHE_DIR}"
CACHE="${2:?usage: sbatch --array=1-N features-array.sh STUDY.yaml CACHE_DIR}"
K="${SLURM_ARRAY_TASK_ID:?run this script as a job array: sbatch --array=1-N ...}"
N="${SLURM_ARRAY_TASK_COUNT:?run this script as a job array: sbatch --array=1-N ...}"
# the first array index must be 1 so that tasks 1..N are the parts 1/N..N/N
if [ "${SLURM_ARRAY_TASK_MIN:-1}" != 1 ]; then
  echo "use --array=1-N (first index 1), got a first index of ${SLURM_ARRAY_TASK_MIN}" >&2
  exit 2
fi

# PATTERNFOLD: the command, e.g. "npx patternfold" in the project folder or an installed bin
PATTERNFOLD="${PATTERNFOLD:-patternfold}"

$PATTERNFOLD features "$STUDY" --shard "$K/$N" --cache "$CACHE" --jobs "${SLURM_CPUS_PER_TASK:-1}"
