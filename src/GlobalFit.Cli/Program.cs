using GlobalFit.Cli;

return CommandLineApp.Run(args, CliContext.FromConsole());
