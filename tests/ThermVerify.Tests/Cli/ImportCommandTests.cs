using ThermVerify.Cli;
using ThermVerify.Design;

namespace ThermVerify.Tests.Cli;

/// <summary>
/// `thermverify import`: for every bundled netlist the starting design loads as it is written, and its guessed sensor,
/// pin and reference are the ones the bundled design names; every guess is marked to confirm; a netlist the reader
/// refuses is exit code 2 with its place, and an existing output file is kept without --force.
/// </summary>
public sealed class ImportCommandTests : IDisposable
{
    private readonly DirectoryInfo folder = Directory.CreateTempSubdirectory("tv-import-");

    public void Dispose() => folder.Delete(recursive: true);

    public static TheoryData<string> Designs => [.. Directory.GetFiles(Repository.Netlists, "*.toml")
        .Where(f => File.ReadAllText(f).Contains("[netlist]")).Select(f => Path.GetFileName(f)).Order()];

    [Theory]
    [MemberData(nameof(Designs))]
    public void The_starting_design_loads_and_guesses_what_the_bundled_design_names(string example)
    {
        var bundled = DesignLoader.Load(Path.Combine(Repository.Netlists, example)).Netlist!;
        File.Copy(Path.Combine(Repository.Netlists, bundled.File), Path.Combine(folder.FullName, bundled.File));
        var output = Path.Combine(folder.FullName, "started.toml");
        var run = CliRunner.Run("import", Path.Combine(folder.FullName, bundled.File), "-o", output);
        Assert.Equal(ExitCodes.Success, run.ExitCode);
        var text = File.ReadAllText(output);
        Assert.Contains("# CONFIRM", text);
        Assert.Contains("# FILL IN", text);
        var started = DesignLoader.Load(output).Netlist!;
        Assert.Equal(bundled.SensorElements, started.SensorElements);
        Assert.Equal(bundled.PinNode, started.PinNode);
        Assert.Equal(bundled.ReferenceNode, started.ReferenceNode);
        Assert.Equal(bundled.Excitation, started.Excitation);
        if (bundled.FixedElement is not null)
            Assert.Equal(bundled.FixedElement, started.FixedElement);

        var again = CliRunner.Run("import", Path.Combine(folder.FullName, bundled.File), "-o", output);
        Assert.Equal(ExitCodes.BadInput, again.ExitCode);
        Assert.Contains("--force", again.Error);
    }

    [Fact]
    public void A_netlist_the_reader_refuses_is_bad_input_at_its_place()
    {
        var path = Path.Combine(folder.FullName, "bad.cir");
        File.WriteAllText(path, "* bad\nV1 a 0 1\nR1 a 0 1k\n.control\nshell touch x\n.endc\n");
        var run = CliRunner.Run("import", path);
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.Contains("bad.cir:4:1", run.Error);
        Assert.Equal("", run.Output);
    }
}
