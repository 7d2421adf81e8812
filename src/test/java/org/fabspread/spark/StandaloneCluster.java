package org.fabspread.spark;

import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.net.HttpURLConnection;
import java.net.ServerSocket;
import java.net.URI;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

/**
 * A Spark standalone cluster on this machine for a test: one master and {@code workers} workers, each a
 * separate JVM ({@code org.apache.spark.deploy.master.Master}, {@code org.apache.spark.deploy.worker.Worker},
 * Spark's own launch classes) bound to 127.0.0.1, started from the test JVM's class path (Spark is there in
 * provided scope). Each worker offers one core and starts its executors as further JVMs in its work folder.
 * {@link #close()} stops every process it started. The executors get the test JVM's class path and its
 * {@code --add-opens} options through {@link #executorClassPath()} and {@link #javaOptions()}.
 */
final class StandaloneCluster implements AutoCloseable {

    private final Path folder;
    private final int port;
    private final int uiPort;
    private final List<Process> processes = new ArrayList<>();

    private StandaloneCluster(Path folder, int port, int uiPort) {
        this.folder = folder;
        this.port = port;
        this.uiPort = uiPort;
    }

    /** Starts the master and the workers and waits (at most {@code timeoutSeconds}) until all have registered. */
    static StandaloneCluster start(Path folder, int workers, int timeoutSeconds) throws IOException, InterruptedException {
        StandaloneCluster c = new StandaloneCluster(folder, freePort(), freePort());
        try {
            // the worker builds its executors' class path from SPARK_HOME/jars: an empty folder, the rest comes
            // from spark.executor.extraClassPath
            Files.createDirectories(folder.resolve("spark-home/jars"));
            c.launch("master", "org.apache.spark.deploy.master.Master",
                    "--host", "127.0.0.1", "--port", String.valueOf(c.port), "--webui-port", String.valueOf(c.uiPort));
            for (int w = 1; w <= workers; w++) {
                Path work = Files.createDirectories(folder.resolve("worker-" + w));
                c.launch("worker-" + w, "org.apache.spark.deploy.worker.Worker", "--host", "127.0.0.1",
                        "--cores", "1", "--memory", "1g", "--webui-port", "0", "--work-dir", work.toString(),
                        c.url());
            }
            long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(timeoutSeconds);
            while (c.registeredWorkers() < workers) {
                for (Process p : c.processes) {
                    if (!p.isAlive()) {
                        throw new IllegalStateException("a cluster process ended with " + p.exitValue()
                                + "; the logs end with:" + c.logTails());
                    }
                }
                if (System.nanoTime() > deadline) {
                    throw new IllegalStateException(c.registeredWorkers() + " of " + workers + " workers registered in "
                            + timeoutSeconds + " s; the logs end with:" + c.logTails());
                }
                Thread.sleep(250);
            }
            return c;
        } catch (IOException | InterruptedException | RuntimeException e) {
            c.close();
            throw e;
        }
    }

    /** The master's URL. */
    String url() {
        return "spark://127.0.0.1:" + port;
    }

    /** The work folder of worker {@code w} (1-based), where it starts its executors. */
    Path workFolder(int w) {
        return folder.resolve("worker-" + w);
    }

    /** The test JVM's class path, for the executors. */
    static String executorClassPath() {
        return System.getProperty("java.class.path");
    }

    /** The test JVM's {@code --add-opens} and {@code -D} options (the ones Spark needs on Java 17). */
    static List<String> javaOptions() {
        return ManagementFactory.getRuntimeMXBean().getInputArguments().stream()
                .filter(a -> a.startsWith("--add-opens") || a.startsWith("-Djdk.reflect") || a.startsWith("-Dio.netty"))
                .toList();
    }

    private void launch(String name, String mainClass, String... args) throws IOException {
        List<String> cmd = new ArrayList<>();
        cmd.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
        cmd.add("-Xmx256m");
        cmd.addAll(javaOptions());
        cmd.add("-cp");
        cmd.add(executorClassPath());
        cmd.add(mainClass);
        cmd.addAll(List.of(args));
        ProcessBuilder pb = new ProcessBuilder(cmd).redirectErrorStream(true)
                .redirectOutput(folder.resolve(name + ".log").toFile());
        pb.environment().put("SPARK_HOME", folder.resolve("spark-home").toString());
        pb.environment().put("SPARK_SCALA_VERSION", "2.13");
        pb.environment().put("SPARK_LOCAL_IP", "127.0.0.1");
        processes.add(pb.start());
    }

    /** Alive workers, as the master's status page ({@code /json/}) counts them; 0 while it is not up. */
    private int registeredWorkers() {
        try {
            HttpURLConnection http = (HttpURLConnection) URI.create("http://127.0.0.1:" + uiPort + "/json/").toURL()
                    .openConnection();
            http.setConnectTimeout(2000);
            http.setReadTimeout(5000);
            try (var in = http.getInputStream()) {
                JsonNode status = new ObjectMapper().readTree(in);
                return status.path("aliveworkers").asInt(0);
            } finally {
                http.disconnect();
            }
        } catch (IOException e) {
            return 0;
        }
    }

    /** The last lines of every process's log, for a failure message. */
    private String logTails() {
        StringBuilder b = new StringBuilder();
        try (Stream<Path> logs = Files.list(folder)) {
            for (Path log : logs.filter(f -> f.toString().endsWith(".log")).sorted().toList()) {
                List<String> lines = Files.readAllLines(log);
                b.append("\n--- ").append(log.getFileName()).append('\n');
                lines.subList(Math.max(0, lines.size() - 6), lines.size()).forEach(l -> b.append(l).append('\n'));
            }
        } catch (IOException e) {
            b.append(' ').append(e);
        }
        return b.toString();
    }

    private static int freePort() throws IOException {
        try (ServerSocket s = new ServerSocket(0)) {
            return s.getLocalPort();
        }
    }

    /** Stops the workers, then the master; forcibly after 20 s. */
    @Override
    public void close() {
        for (int i = processes.size() - 1; i >= 0; i--) {
            Process p = processes.get(i);
            p.descendants().forEach(ProcessHandle::destroy); // a worker's executors
            p.destroy();
            try {
                if (!p.waitFor(20, TimeUnit.SECONDS)) {
                    p.destroyForcibly().waitFor(10, TimeUnit.SECONDS);
                }
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                p.destroyForcibly();
            }
        }
    }
}
