return Sibyl.Cli.Entry.Run(args);
