package org.fabspread.cli;

import java.io.PrintWriter;

import org.fabspread.study.StudyException;

import picocli.CommandLine;

/**
 * Entry point. Exit codes: 0 ok, 1 failure while running, 2 bad input or usage. Bad input is one
 * line on stderr; a stack trace only with {@code --debug}.
 */
public final class Main {

    private Main() {
    }

    public static void main(String[] args) {
        System.exit(run(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true)));
    }

    /** Runs the command line and returns the exit code (used by tests too). */
    public static int run(String[] args, PrintWriter out, PrintWriter err) {
        boolean debug = false;
        for (String a : args) {
            if (a.equals("--debug")) {
                debug = true;
            }
        }
        final boolean showTrace = debug;
        CommandLine cl = new CommandLine(new FabspreadCommand());
        cl.setOut(out);
        cl.setErr(err);
        cl.setParameterExceptionHandler((ex, a) -> {
            err.println("fabspread: " + ex.getMessage());
            err.println("Try 'fabspread " + commandPath(ex.getCommandLine()) + " --help'.");
            return ExitCodes.BAD_INPUT;
        });
        cl.setExecutionExceptionHandler((ex, c, parsed) -> {
            Throwable t = ex;
            if (t instanceof StudyException) {
                err.println(t.getMessage());
                if (showTrace) {
                    t.printStackTrace(err);
                }
                return ExitCodes.BAD_INPUT;
            }
            err.println("fabspread: " + (t.getMessage() == null ? t.getClass().getSimpleName() : t.getMessage()));
            if (showTrace) {
                t.printStackTrace(err);
            } else {
                err.println("(run again with --debug for details)");
            }
            return ExitCodes.FAILURE;
        });
        int code = cl.execute(args);
        out.flush();
        err.flush();
        return code;
    }

    private static String commandPath(CommandLine c) {
        String name = c.getCommandName();
        return "<main class>".equals(name) || "fabspread".equals(name) ? "" : name;
    }
}
