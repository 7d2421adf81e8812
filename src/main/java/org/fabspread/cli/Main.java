package org.fabspread.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.AccessDeniedException;
import java.nio.file.NoSuchFileException;
import java.util.List;

import org.fabspread.model.ModelException;
import org.fabspread.pipeline.Terminal;
import org.fabspread.sampling.RunFailedException;
import org.fabspread.study.StudyException;

import picocli.CommandLine;

/**
 * Entry point. Exit codes: 0 ok, 1 a fault of the program or its surroundings (disk, memory), 2 bad input
 * or usage. Every error is one line on stderr that starts with {@code fabspread: } exactly once, then, where
 * the error is about a file, its location ({@code fabspread: file:line:col: key: what}); a stack trace only
 * with {@code --debug}.
 */
public final class Main {

    /** The one prefix every error line starts with. */
    static final String PREFIX = "fabspread: ";

    private Main() {
    }

    public static void main(String[] args) {
        System.exit(run(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true)));
    }

    /** Runs the command line and returns the exit code (used by tests too). */
    public static int run(String[] args, PrintWriter out, PrintWriter err) {
        boolean debug = List.of(args).contains("--debug");
        CommandLine cl = new CommandLine(new FabspreadCommand());
        cl.setOut(out);
        cl.setErr(err);
        cl.setParameterExceptionHandler((ex, a) -> {
            StringBuilder line = new StringBuilder("fabspread: ");
            List<String> near = ex instanceof CommandLine.UnmatchedArgumentException u && !u.getUnmatched().isEmpty()
                    ? Suggestions.near(u.getUnmatched().get(0), ex.getCommandLine()) : List.of();
            if (ex instanceof CommandLine.UnmatchedArgumentException u && !u.getUnmatched().isEmpty()) {
                String first = u.getUnmatched().get(0);
                line.append(first.startsWith("-") ? "unknown option '" : "unknown command or argument '")
                        .append(oneLine(first)).append("'");
            } else {
                line.append(oneLine(ex.getMessage()));
            }
            if (!near.isEmpty()) {
                line.append(" (did you mean ").append(String.join(" or ", near.stream().limit(3)
                        .map(x -> "'" + x + "'").toList())).append("?)");
            }
            line.append("; see 'fabspread ").append(commandPath(ex.getCommandLine())).append("--help'");
            err.println(line);
            return ExitCodes.BAD_INPUT;
        });
        cl.setExecutionExceptionHandler((ex, c, parsed) -> {
            int code = report(ex, err, debug);
            return code;
        });
        int code;
        try {
            code = cl.execute(args);
        } catch (OutOfMemoryError e) {
            err.println("fabspread: out of memory (the Java heap holds " + Runtime.getRuntime().maxMemory() / 1_000_000
                    + " MB); use fewer samples or a smaller sobol_base, or give Java more memory (-Xmx)");
            if (debug) {
                e.printStackTrace(err);
            }
            code = ExitCodes.FAILURE;
        } catch (StackOverflowError e) {
            err.println("fabspread: internal error: stack overflow (run again with --debug for the stack trace)");
            if (debug) {
                e.printStackTrace(err);
            }
            code = ExitCodes.FAILURE;
        }
        out.flush();
        err.flush();
        return code;
    }

    /** Prints one line for a failure and returns its exit code. */
    static int report(Throwable t, PrintWriter err, boolean debug) {
        int code;
        String line;
        if (t instanceof StudyException) {
            code = ExitCodes.BAD_INPUT;
            line = prefixed(t.getMessage());
        } else if (t instanceof ModelException m) {
            code = ExitCodes.BAD_INPUT;
            line = "fabspread: the device model refuses the study: " + oneLine(m.getMessage());
        } else if (t instanceof RunFailedException && t.getCause() == null) {
            code = ExitCodes.BAD_INPUT;
            line = prefixed(t.getMessage());
        } else if (t instanceof NoSuchFileException f) {
            code = ExitCodes.FAILURE;
            line = "fabspread: " + f.getFile() + ": no such file or folder";
        } else if (t instanceof AccessDeniedException f) {
            code = ExitCodes.FAILURE;
            line = "fabspread: " + f.getFile() + ": permission denied";
        } else if (t instanceof IOException) {
            code = ExitCodes.FAILURE;
            line = prefixed(t.getMessage() == null ? t.getClass().getSimpleName() : t.getMessage());
        } else if (t instanceof OutOfMemoryError) {
            code = ExitCodes.FAILURE;
            line = "fabspread: out of memory; use fewer samples or a smaller sobol_base, or give Java more memory"
                    + " (-Xmx)";
        } else {
            code = ExitCodes.FAILURE;
            line = "fabspread: internal error: " + oneLine(t.getMessage() == null ? t.getClass().getSimpleName()
                    : t.getMessage()) + (debug ? "" : " (run again with --debug for the stack trace)");
        }
        err.println(line);
        if (debug) {
            t.printStackTrace(err);
        }
        err.flush();
        return code;
    }

    private static String prefixed(String message) {
        String m = oneLine(message);
        return m.startsWith(PREFIX) ? m : PREFIX + m;
    }

    /** A message on one line with control characters escaped. */
    private static String oneLine(String s) {
        return Terminal.printable(s == null ? "" : s.replace("\r\n", " ").replace('\n', ' ').replace('\r', ' '));
    }

    private static String commandPath(CommandLine c) {
        String name = c.getCommandName();
        return "<main class>".equals(name) || "fabspread".equals(name) ? "" : name + " ";
    }
}
