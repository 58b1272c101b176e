using ThermVerify.Cli;

// Ctrl+C and SIGTERM cancel the run (Interruption); what reaches the terminal goes through TerminalText: no escape
// code from a design is written raw.
Interruption.Listen();
return CliApp.Run(args, new TerminalText(Console.Out), new TerminalText(Console.Error));
