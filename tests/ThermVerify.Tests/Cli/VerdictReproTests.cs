using ThermVerify.Cli;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Cli;

/// <summary>
/// The two cases where a declared error used to be left out of the verdict: raised converter errors on the oven
/// example, and a large op-amp drift on the buffered probe. Each passes as written and, with the error raised, exits 1
/// with the finding that names the cause failing on its own size.
/// </summary>
public sealed class VerdictReproTests : IDisposable
{
    private readonly DirectoryInfo folder = Directory.CreateTempSubdirectory("thermverify-repro-");

    public void Dispose() => folder.Delete(recursive: true);

    private string Edited(string example, params (string From, string To)[] edits)
    {
        var text = File.ReadAllText(Path.Combine(ExampleDesigns.Folder(), example));
        foreach (var (from, to) in edits)
        {
            Assert.Contains(from, text);
            text = text.Replace(from, to);
        }
        var path = Path.Combine(folder.FullName, example);
        File.WriteAllText(path, text);
        return path;
    }

    [Fact]
    public void Raised_converter_offset_and_inl_fail_the_oven_for_the_converter()
    {
        Assert.Equal(ExitCodes.Success, CliRunner.Run("check", Path.Combine(ExampleDesigns.Folder(), "oven-pt1000.toml"), "-q", "--no-remedies").ExitCode);
        var run = CliRunner.Run("check", Edited("oven-pt1000.toml", ("offset_error = \"0.5 LSB\"", "offset_error = \"10 LSB\""), ("inl = \"1 LSB\"", "inl = \"8 LSB\"")), "--no-remedies");
        Assert.Equal(ExitCodes.CheckFailed, run.ExitCode);
        Assert.Contains("FAIL converter:", run.Output);
        Assert.Contains("the largest contribution at", run.Output);
        Assert.Contains("is converter", run.Output);
    }

    [Fact]
    public void A_large_op_amp_drift_fails_the_buffered_probe_for_the_buffer()
    {
        Assert.Equal(ExitCodes.Success, CliRunner.Run("check", Path.Combine(ExampleDesigns.Folder(), "buffered-cable-probe.toml"), "-q", "--no-remedies").ExitCode);
        var run = CliRunner.Run("check", Edited("buffered-cable-probe.toml", ("offset_drift = \"2 uV/K\"", "offset_drift = \"200 uV/K\"")), "--no-remedies");
        Assert.Equal(ExitCodes.CheckFailed, run.ExitCode);
        Assert.Contains("FAIL buffer-static:", run.Output);
        Assert.Contains("drift ±200 µV/K (a bound)", run.Output);
        Assert.Contains("is buffer", run.Output);
    }
}
