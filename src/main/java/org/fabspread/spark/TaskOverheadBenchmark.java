package org.fabspread.spark;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.apache.spark.SparkConf;
import org.apache.spark.api.java.JavaRDD;
import org.apache.spark.api.java.JavaSparkContext;

/**
 * What one Spark task costs beyond its work, measured with tasks that do nothing: the wall time of
 * {@code jobs} one-task jobs run one after the other (the cost of a job of one partition, as
 * {@link InOrderJobs} submits them), and of one job of {@code tasks} empty tasks (the scheduler's cost per
 * task when the cores are kept busy). Run by {@code bench/spark-vs-local.sh}; arguments
 * {@code [MASTER] [JOBS] [TASKS]}, default {@code local[2] 200 2000}. A benchmark, never a test.
 */
public final class TaskOverheadBenchmark {

    private TaskOverheadBenchmark() {
    }

    public static void main(String[] args) {
        String master = args.length > 0 ? args[0] : "local[2]";
        int jobs = args.length > 1 ? Integer.parseInt(args[1]) : 200;
        int tasks = args.length > 2 ? Integer.parseInt(args[2]) : 2000;
        SparkConf conf = new SparkConf().setAppName("fabspread task overhead").setMaster(master)
                .set("spark.ui.enabled", "false");
        try (JavaSparkContext sc = new JavaSparkContext(conf)) {
            sc.setLogLevel("WARN");
            List<Integer> items = new ArrayList<>();
            for (int i = 0; i < tasks; i++) {
                items.add(i);
            }
            JavaRDD<Integer> rdd = sc.parallelize(items, tasks);
            // warm-up: class loading, the first job's set-up
            for (int i = 0; i < 20; i++) {
                rdd.collectPartitions(new int[] {i % tasks});
            }
            rdd.count();
            long t0 = System.nanoTime();
            for (int i = 0; i < jobs; i++) {
                rdd.collectPartitions(new int[] {i % tasks});
            }
            long t1 = System.nanoTime();
            rdd.count();
            long t2 = System.nanoTime();
            System.out.printf(Locale.ROOT, "one-task job, one after the other: %.2f ms per job (%d jobs on %s)%n",
                    (t1 - t0) / 1e6 / jobs, jobs, sc.master());
            System.out.printf(Locale.ROOT, "empty tasks of one job: %.3f ms per task (%d tasks on %d cores)%n",
                    (t2 - t1) / 1e6 / tasks, tasks, sc.defaultParallelism());
        }
    }
}
