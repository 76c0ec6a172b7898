return OmicsScreen.Cli.CommandLine.Run(args);
