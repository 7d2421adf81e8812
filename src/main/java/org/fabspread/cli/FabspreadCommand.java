package org.fabspread.cli;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** The top-level command: prints help when called without a subcommand. */
@Command(name = "fabspread", mixinStandardHelpOptions = true, versionProvider = VersionProvider.class,
        description = "How much short-circuit current does process scatter cost a plasmonic organic solar cell,"
                + " what yield does it leave, and which tolerance should be tightened?",
        subcommands = {
            MaterialsCommand.class,
            CheckCommand.class,
            OpticsCommand.class,
            ParticlesCommand.class,
            RunCommand.class,
            EvalCommand.class,
            PlanCommand.class,
            MeasuredCommand.class,
            DemoCommand.class,
            BenchCommand.class,
            picocli.AutoComplete.GenerateCompletion.class,
        })
public final class FabspreadCommand implements Runnable {

    @Spec
    CommandSpec spec;

    @Option(names = "--debug", description = "Show stack traces on errors.", scope = picocli.CommandLine.ScopeType.INHERIT)
    boolean debug;

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }
}
