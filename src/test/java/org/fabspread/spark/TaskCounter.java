package org.fabspread.spark;

import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicInteger;

import org.apache.spark.scheduler.SparkListener;
import org.apache.spark.scheduler.SparkListenerJobStart;
import org.apache.spark.scheduler.SparkListenerTaskEnd;

/**
 * A Spark listener (registered through {@code spark.extraListeners}) that counts the successful tasks of
 * each batch, by the batch name at the head of its jobs' descriptions ("Sobol design chunks 0-0"): the
 * evidence that a batch ran as Spark tasks and not on the driver.
 */
public final class TaskCounter extends SparkListener {

    /** Successful tasks per batch name, over every context of this JVM since the last {@link #reset()}. */
    static final Map<String, AtomicInteger> TASKS = new ConcurrentHashMap<>();

    private final Map<Integer, String> stageBatch = new ConcurrentHashMap<>();

    static void reset() {
        TASKS.clear();
    }

    static int tasks(String batch) {
        AtomicInteger n = TASKS.get(batch);
        return n == null ? 0 : n.get();
    }

    @Override
    public void onJobStart(SparkListenerJobStart e) {
        String d = e.properties() == null ? null : e.properties().getProperty("spark.job.description");
        if (d == null) {
            return;
        }
        String batch = d.replaceFirst(" chunks \\d+-\\d+$", "");
        for (Object id : scala.jdk.javaapi.CollectionConverters.asJava(e.stageIds())) {
            stageBatch.put((Integer) id, batch);
        }
    }

    @Override
    public void onTaskEnd(SparkListenerTaskEnd e) {
        String batch = stageBatch.get(e.stageId());
        if (batch != null && e.taskInfo().successful()) {
            TASKS.computeIfAbsent(batch, b -> new AtomicInteger()).incrementAndGet();
        }
    }
}
