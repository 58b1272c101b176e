using ThermVerify.Cli;

// What reaches the terminal goes through TerminalText: no escape code from a design is written raw.
return CliApp.Run(args, new TerminalText(Console.Out), new TerminalText(Console.Error));
