#!/usr/bin/env bash
# Wall time of one study run on the local engine and on the Spark engine (--master local[2]) on this machine,
# their ratio, the Spark engine's fixed cost and per-task overhead, and a byte-for-byte check of the output
# files. Usage: bench/spark-vs-local.sh [SAMPLES] [STUDY]   (defaults: 1000000, the pilot-line demo)
#
# Measures, all wall-clock (the machine is shared: the load average is printed before and after):
#   local, spark   the whole run (main Monte Carlo, Sobol/Shapley designs, what-ifs, plan) at SAMPLES
#   fixed          spark − local for a one-chunk run (1024 samples): Spark context start, broadcast,
#                  each executor's rebuild of the study's model, one task
#   per task       (spark − local − fixed) / tasks at SAMPLES, the tasks read from the engine's log line
#                  (on a loaded machine this difference drowns in noise), and directly: tasks that do nothing
#                  (spark.TaskOverheadBenchmark: 200 one-task jobs one after the other, one job of 2000 tasks)
# Only the main Monte Carlo runs on Spark; the other batches run on the driver's local engine in both runs.
set -euo pipefail

samples="${1:-1000000}"
study="${2:-demo-studies/pilot-line-inverted.yaml}"
home="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$home"
work="$(mktemp -d "${TMPDIR:-/tmp}/fabspread-bench-XXXXXX")"
trap 'rm -rf "$work"' EXIT

# build the jar and resolve Spark before timing anything
./fabspread --help >/dev/null
if [ ! -s target/spark.classpath ] || [ pom.xml -nt target/spark.classpath ]; then
  mvn -B -q dependency:build-classpath -Dmdep.includeScope=provided -Dmdep.outputFile=target/spark.classpath >&2
fi

now() { date +%s%N; }
# run NAME SAMPLES [extra args]: prints the wall time in ms, output in $work/NAME, log in $work/NAME.log
run() {
  local name="$1" n="$2"
  shift 2
  local t0 t1
  t0=$(now)
  ./fabspread run "$study" --samples "$n" --threads 2 --no-report --quiet --out "$work/$name" "$@" \
    >"$work/$name.log" 2>&1 || { echo "bench: run $name failed:" >&2; tail -20 "$work/$name.log" >&2; exit 1; }
  t1=$(now)
  echo $(( (t1 - t0) / 1000000 ))
}
same() {
  local a="$1" b="$2" bad=0
  while IFS= read -r f; do
    if ! cmp -s "$a/$f" "$b/$f"; then echo "DIFFERENT: $f"; bad=1; fi
  done < <(cd "$a" && find . -type f | sort)
  [ "$(cd "$a" && find . -type f | sort)" = "$(cd "$b" && find . -type f | sort)" ] || { echo "DIFFERENT: file lists"; bad=1; }
  return $bad
}
secs() { awk -v ms="$1" 'BEGIN { printf "%.1f s", ms / 1000 }'; }

echo "study $study, $samples samples, 2 threads; load before: $(cut -d' ' -f1-3 /proc/loadavg)"
l1=$(run local1 1024)
s1=$(run spark1 1024 --engine spark --master 'local[2]')
l=$(run local "$samples")
s=$(run spark "$samples" --engine spark --master 'local[2]')
tasks=$(sed -n 's/.*spark engine: [0-9]* chunks in \([0-9]*\) tasks.*/\1/p' "$work/spark.log" | head -1)
echo "load after: $(cut -d' ' -f1-3 /proc/loadavg)"
echo "local engine:        $(secs "$l")"
echo "spark local[2]:      $(secs "$s")  ($(sed -n 's/.*\(spark engine: [0-9]* chunks in .*\)/\1/p' "$work/spark.log" | head -1))"
awk -v s="$s" -v l="$l" 'BEGIN { printf "ratio spark/local:   %.3f\n", s / l }'
echo "fixed cost (1 chunk): $(secs $(( s1 - l1 )))  (local $(secs "$l1"), spark $(secs "$s1"))"
awk -v s="$s" -v l="$l" -v f=$(( s1 - l1 )) -v t="${tasks:-0}" \
  'BEGIN { if (t > 0) printf "per-task overhead:   %.1f ms  ((spark - local - fixed) / %d tasks)\n", (s - l - f) / t, t }'
opens="$(sed -n 's:.*<spark.jvm.options>\(.*\)</spark.jvm.options>.*:\1:p' pom.xml)"
# shellcheck disable=SC2086
java $opens -cp "target/fabspread.jar:$(cat target/spark.classpath)" org.fabspread.spark.TaskOverheadBenchmark \
  'local[2]' 200 2000 2>/dev/null
status=0
same "$work/local1" "$work/spark1" || status=1
same "$work/local" "$work/spark" || status=1
if [ $status = 0 ]; then echo "output files byte-identical (cmp): yes"; else echo "output files byte-identical (cmp): NO"; fi
exit $status
