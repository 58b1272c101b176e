using System.Diagnostics;
using ThermVerify.Cli;
using ThermVerify.Tests.Cli;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Hardening;

/// <summary>
/// A design checked with --engine ngspice cannot make ngspice run a command: not through a control section in its
/// subcircuit file, not through a path that smuggles one into the deck, not through a start-up file in the folder
/// the check is started from, and not through a link out of its folder. Each attack would create a canary file; it
/// never exists, in either ngspice mode.
/// </summary>
public sealed class NgspiceSecurityTests : IDisposable
{
    private readonly HostileFolder folder = new();

    public void Dispose() => folder.Dispose();

    private const string Buffer = """

        [buffer]
        gain_bandwidth = "1 MHz"
        supply = "0 V .. 3.3 V"
        subckt_file = "{0}"
        subckt_name = "amp"
        """;

    private string BufferedDesign(string subcircuitPath) => folder.Design(string.Format(Buffer, subcircuitPath));

    public static TheoryData<string> Modes => new() { "library", "process" };

    private static string[] Engine(string mode) => mode == "process" ? ["--engine", "ngspice", "--ngspice-process"] : ["--engine", "ngspice"];

    [NgspiceTheory]
    [MemberData(nameof(Modes))]
    public void A_control_section_in_the_subcircuit_file_never_runs(string mode)
    {
        folder.Write("amp.lib", $".subckt amp inp inn vcc vee out\nE1 out 0 inp inn 1e5\n.ends amp\n.control\n{folder.TouchCanary}\n.endc\n");
        var run = CliRunner.Run(["check", BufferedDesign("amp.lib"), "-q", .. Engine(mode)]);
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.Contains("amp.lib:4:1: buffer.subckt_file: '.control' is not accepted", run.Error);
        Assert.False(File.Exists(folder.Canary));
    }

    [NgspiceTheory]
    [MemberData(nameof(Modes))]
    public void A_shell_line_inside_the_subcircuit_is_refused_not_run(string mode)
    {
        folder.Write("amp.lib", $".subckt amp inp inn vcc vee out\nE1 out 0 inp inn 1e5\n{folder.TouchCanary}\n.ends amp\n");
        var run = CliRunner.Run(["check", BufferedDesign("amp.lib"), "-q", .. Engine(mode)]);
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.Contains("amp.lib:3:1", run.Error);
        Assert.False(File.Exists(folder.Canary));
    }

    [NgspiceTheory]
    [MemberData(nameof(Modes))]
    public void A_path_that_would_inject_a_control_block_into_the_deck_is_refused(string mode)
    {
        // A folder whose name closes the quote of an .include and starts a control section on the next lines.
        var name = $"x\"\n.control\n{folder.TouchCanary}\n.endc\n*";
        string hostile;
        try
        {
            hostile = Path.Combine(folder.DesignFolder, name);
            Directory.CreateDirectory(hostile);
        }
        catch (IOException)
        {
            return; // a file system that cannot hold such a name cannot be attacked with one
        }
        File.WriteAllText(Path.Combine(hostile, "amp.lib"), ".subckt amp inp inn vcc vee out\nE1 out 0 inp inn 1e5\n.ends amp\n");
        var escaped = name.Replace("\\", "\\\\").Replace("\"", "\\\"").Replace("\n", "\\n") + "/amp.lib";
        var run = CliRunner.Run(["check", BufferedDesign(escaped), "-q", .. Engine(mode)]);
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.False(File.Exists(folder.Canary));
    }

    [NgspiceTheory]
    [MemberData(nameof(Modes))]
    public void A_subcircuit_through_a_link_out_of_the_folder_is_never_read(string mode)
    {
        File.WriteAllText(Path.Combine(folder.Outside, "amp.lib"), ".subckt amp inp inn vcc vee out\nE1 out 0 inp inn 1e5\n.ends amp\n");
        Directory.CreateSymbolicLink(Path.Combine(folder.DesignFolder, "models"), folder.Outside);
        var run = CliRunner.Run(["check", BufferedDesign("models/amp.lib"), "-q", .. Engine(mode)]);
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.Contains("leads outside the design's folder", run.Error);
    }

    [NgspiceTheory]
    [MemberData(nameof(Modes))]
    public void A_start_up_file_in_the_folder_the_check_starts_from_is_never_read(string mode)
    {
        // A CI job checks a repository's design from the repository's root, where the repository put a .spiceinit.
        folder.Write(".spiceinit", $"{folder.TouchCanary}\necho SPICEINIT-WAS-READ\n");
        var start = new ProcessStartInfo("dotnet",
            [Path.Combine(AppContext.BaseDirectory, "ThermVerify.Cli.dll"), "check", folder.Design(), "-q", "--sampling-points", "2", "--no-remedies", .. Engine(mode)])
        {
            RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false, WorkingDirectory = folder.DesignFolder,
        };
        using var process = Process.Start(start)!;
        var output = process.StandardOutput.ReadToEndAsync();
        var error = process.StandardError.ReadToEndAsync();
        process.WaitForExit();
        Assert.True(process.ExitCode is ExitCodes.Success or ExitCodes.CheckFailed, error.Result);
        Assert.DoesNotContain("SPICEINIT-WAS-READ", output.Result + error.Result);
        Assert.False(File.Exists(folder.Canary));
    }
}
