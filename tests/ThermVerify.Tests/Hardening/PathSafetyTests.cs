using System.Diagnostics;
using ThermVerify.Cli;
using ThermVerify.Design;
using ThermVerify.Tests.Cli;

namespace ThermVerify.Tests.Hardening;

/// <summary>
/// A design may read only regular files inside its own folder, where they really are: links (to files or folders),
/// hard links, devices, FIFOs and oversized files are refused before anything is read, and no refusal quotes the
/// content of a file outside the folder.
/// </summary>
public sealed class PathSafetyTests : IDisposable
{
    private const string Secret = "SECRET-FIRST-LINE";
    private readonly HostileFolder folder = new();

    public void Dispose() => folder.Dispose();

    private static string TableDesign(string path) =>
        HostileFolder.DesignText().Replace("model = \"beta\"\nr25 = \"10 kohm\"\nbeta = 3435", $"model = \"table\"\nfile = \"{path}\"");

    private DesignException LoadRefused(string designPath) => Assert.Throws<DesignException>(() => DesignLoader.Load(designPath));

    private string OutsideFile()
    {
        var path = Path.Combine(folder.Outside, "rt.csv");
        File.WriteAllText(path, $"{Secret}\n-50,300000\n0,30000\n50,4000\n130,300\n");
        return path;
    }

    [Fact]
    public void A_symlinked_folder_that_leads_outside_is_resolved_before_the_check()
    {
        OutsideFile();
        Directory.CreateSymbolicLink(Path.Combine(folder.DesignFolder, "data"), folder.Outside);
        var design = folder.Write("t.toml", TableDesign("data/rt.csv"));
        var e = LoadRefused(design);
        Assert.Contains("leads outside the design's folder", e.Problem);
        Assert.DoesNotContain(Secret, e.Message);
        Assert.Equal("sensor.file", e.KeyPath);
    }

    [Fact]
    public void A_link_inside_the_folder_to_a_file_inside_it_is_followed()
    {
        folder.Write("tables/real.csv", "celsius,ohms\n-50,300000\n0,30000\n50,4000\n130,300\n");
        File.CreateSymbolicLink(Path.Combine(folder.DesignFolder, "rt.csv"), Path.Combine("tables", "real.csv"));
        var loaded = DesignLoader.Load(folder.Write("t.toml", TableDesign("rt.csv")));
        Assert.EndsWith(Path.Combine("tables", "real.csv"), Assert.IsType<TableSensorSpec>(loaded.Sensor).FullPath);
    }

    [Fact]
    public void Dot_dot_through_a_linked_folder_is_resolved_physically()
    {
        // design/sub -> outside/deep: "sub/../rt.csv" is outside/rt.csv physically, though it reads as design/rt.csv.
        OutsideFile();
        Directory.CreateDirectory(Path.Combine(folder.Outside, "deep"));
        Directory.CreateSymbolicLink(Path.Combine(folder.DesignFolder, "sub"), Path.Combine(folder.Outside, "deep"));
        folder.Write("rt.csv", "celsius,ohms\n-50,300000\n0,30000\n50,4000\n130,300\n");
        var e = LoadRefused(folder.Write("t.toml", TableDesign("sub/../rt.csv")));
        Assert.Contains("leads outside", e.Problem);
    }

    [Fact]
    public void A_hard_link_is_refused_because_its_other_name_may_lie_outside()
    {
        if (!OperatingSystem.IsLinux()) return; // the link count comes from statx(2)
        var outside = OutsideFile();
        var inside = Path.Combine(folder.DesignFolder, "rt.csv");
        Process.Start("ln", [outside, inside])!.WaitForExit();
        var e = LoadRefused(folder.Write("t.toml", TableDesign("rt.csv")));
        Assert.Contains("2 names (hard links)", e.Problem);
        Assert.DoesNotContain(Secret, e.Message);
    }

    [Theory]
    [InlineData("/dev/zero")]
    [InlineData("/dev/null")]
    public void A_device_is_refused_as_a_table_and_as_the_design(string device)
    {
        if (!OperatingSystem.IsLinux()) return;
        File.CreateSymbolicLink(Path.Combine(folder.DesignFolder, "rt.csv"), device); // leads outside as well
        var e = LoadRefused(folder.Write("t.toml", TableDesign("rt.csv")));
        Assert.Contains("outside", e.Problem);
        Assert.Contains("is a device", Assert.Throws<DesignException>(() => DesignLoader.Load(device)).Problem);
    }

    [Fact]
    public void A_fifo_is_refused_without_blocking()
    {
        if (!OperatingSystem.IsLinux()) return;
        var fifo = Path.Combine(folder.DesignFolder, "rt.csv");
        Process.Start("mkfifo", [fifo])!.WaitForExit();
        var e = LoadRefused(folder.Write("t.toml", TableDesign("rt.csv")));
        Assert.Contains("FIFO", e.Problem);
        Assert.Contains("FIFO", Assert.Throws<DesignException>(() => DesignLoader.Load(fifo)).Problem);
    }

    [Fact]
    public void A_fifo_or_a_device_as_a_baseline_or_a_firmware_table_is_refused_without_blocking()
    {
        if (!OperatingSystem.IsLinux()) return;
        var fifo = Path.Combine(folder.DesignFolder, "named-pipe");
        Process.Start("mkfifo", [fifo])!.WaitForExit();
        var design = folder.Design();
        var baseline = CliRunner.Run("check", design, "-q", "--baseline", fifo);
        Assert.Equal(ExitCodes.BadInput, baseline.ExitCode);
        Assert.Contains("FIFO", baseline.Error);
        var table = CliRunner.Run("verify-table", design, "/dev/zero");
        Assert.Equal(ExitCodes.BadInput, table.ExitCode);
        Assert.Contains("is a device", table.Error);
    }

    [Fact]
    public void A_file_larger_than_the_limit_is_refused_and_the_limit_can_be_raised()
    {
        var design = folder.Design("# " + new string('x', 5 << 20) + "\n");
        var refused = CliRunner.Run("validate", design);
        Assert.Equal(ExitCodes.BadInput, refused.ExitCode);
        Assert.Contains("larger than the limit", refused.Error);
        Assert.Equal(ExitCodes.Success, CliRunner.Run("validate", design, "--max-file-size", (8 << 20).ToString()).ExitCode);
    }

    [Theory]
    [InlineData("rt\\\".csv")]
    [InlineData("rt'.csv")]
    [InlineData("a\\\\b.csv")]
    public void Paths_with_quotes_are_refused(string path)
    {
        var e = LoadRefused(folder.Write("t.toml", TableDesign(path)));
        Assert.Contains("the path holds the character", e.Problem);
    }

    [Fact]
    public void Paths_with_control_characters_are_refused()
    {
        var e = LoadRefused(folder.Write("t.toml", TableDesign("rt\\n.control\\n.csv")));
        Assert.Contains("control character U+000A", e.Problem);
    }

    [Fact]
    public void An_absolute_path_and_a_path_up_and_out_are_refused()
    {
        OutsideFile();
        Assert.Contains("absolute path", LoadRefused(folder.Write("a.toml", TableDesign(Path.Combine(folder.Outside, "rt.csv")))).Problem);
        Assert.Contains("leads outside", LoadRefused(folder.Write("b.toml", TableDesign("../outside/rt.csv"))).Problem);
    }
}
