using ThermVerify.Cli;
using ThermVerify.Files;
using ThermVerify.Tests.Cli;

namespace ThermVerify.Tests.Hardening;

/// <summary>
/// Outputs are checked before any work and written as one set: a folder, a link, a device or a missing folder is
/// never written to or replaced, every existing file needs --force, and when one output is refused none is written.
/// </summary>
public sealed class OutputSafetyTests : IDisposable
{
    private readonly HostileFolder folder = new();

    public void Dispose() => folder.Dispose();

    /// <summary>With one conversion allowed, no sampling run can settle: a check that simulates at all exits 3.</summary>
    // ngspice's sampling runs conversion by conversion (the built-in engine computes the steady state directly), so one
    // conversion allowed makes any simulation fail: the refusal must have come before it.
    private static readonly string[] FailsIfSimulated = ["--engine", "ngspice", "--max-conversions", "1"];

    [Fact]
    public void A_link_as_an_output_is_refused_even_with_force_and_its_target_is_untouched()
    {
        var target = Path.Combine(folder.Outside, "precious.txt");
        File.WriteAllText(target, "keep me");
        var link = Path.Combine(folder.DesignFolder, "out.json");
        File.CreateSymbolicLink(link, target);
        var run = CliRunner.Run("check", folder.Design(), "-q", "--json", link, "--force");
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.Contains("is a link", run.Error);
        Assert.Equal("keep me", File.ReadAllText(target));
        Assert.NotNull(new FileInfo(link).LinkTarget);
    }

    [Fact]
    public void A_device_as_an_output_is_refused_even_with_force()
    {
        if (!OperatingSystem.IsLinux()) return;
        var run = CliRunner.Run("deck", folder.Design(), "--out", "/dev/null", "--force");
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.Contains("is a device", run.Error);
        Assert.Equal(FileKind.CharacterDevice, OutputTarget.KindOf("/dev/null"));
    }

    [Theory]
    [InlineData("deck", "--out")]
    [InlineData("table", "--csv")]
    [InlineData("worstcase", "--csv")]
    [InlineData("montecarlo", "--units-csv")]
    [InlineData("montecarlo", "--csv")]
    public void Every_output_needs_force_to_replace_a_file(string command, string option)
    {
        var existing = Path.Combine(folder.DesignFolder, "existing.txt");
        File.WriteAllText(existing, "before");
        string[] extra = command == "montecarlo" ? ["-n", "2", "--no-unit-settling"] : [];
        var refused = CliRunner.Run([command, folder.Design(), option, existing, .. extra]);
        Assert.Equal(ExitCodes.BadInput, refused.ExitCode);
        Assert.Contains("exists already; pass --force", refused.Error);
        Assert.Equal("before", File.ReadAllText(existing));
    }

    [Fact]
    public void An_output_folder_that_is_a_file_or_missing_is_refused_before_the_work()
    {
        var file = folder.Write("plain.txt", "x");
        var design = folder.Design();
        Assert.Equal(ExitCodes.SimulationFailed, CliRunner.Run(["check", design, "-q", .. FailsIfSimulated]).ExitCode);
        var insideFile = CliRunner.Run(["check", design, "-q", "--json", Path.Combine(file, "out.json"), .. FailsIfSimulated]);
        Assert.Equal(ExitCodes.BadInput, insideFile.ExitCode);
        Assert.Contains("is a file, where a folder is needed", insideFile.Error);
        var missing = CliRunner.Run(["check", design, "-q", "--junit", Path.Combine(folder.DesignFolder, "no", "such", "out.xml"), .. FailsIfSimulated]);
        Assert.Equal(ExitCodes.BadInput, missing.ExitCode);
        Assert.Contains("does not exist; create it first", missing.Error);
        var directory = CliRunner.Run(["check", design, "-q", "--json", folder.DesignFolder, .. FailsIfSimulated]);
        Assert.Equal(ExitCodes.BadInput, directory.ExitCode);
        Assert.Contains("is a folder", directory.Error);
        var reportOnFile = CliRunner.Run(["check", design, "-q", "--report", file, .. FailsIfSimulated]);
        Assert.Equal(ExitCodes.BadInput, reportOnFile.ExitCode);
        Assert.Contains("where a folder is needed", reportOnFile.Error);
    }

    [Fact]
    public void A_report_folder_is_made_when_missing_and_an_existing_report_is_refused_before_the_work()
    {
        var design = folder.Design();
        var report = Path.Combine(folder.DesignFolder, "new-report");
        var made = CliRunner.Run("check", design, "-q", "--report", report);
        Assert.True(made.ExitCode is ExitCodes.Success or ExitCodes.CheckFailed, made.Error);
        Assert.True(File.Exists(Path.Combine(report, "report.md")));
        var again = CliRunner.Run(["check", design, "-q", "--report", report, .. FailsIfSimulated]);
        Assert.Equal(ExitCodes.BadInput, again.ExitCode);
        Assert.Contains("pass --force to replace it", again.Error);
    }

    [Fact]
    public void A_link_planted_inside_a_report_folder_is_not_written_through()
    {
        var report = Path.Combine(folder.DesignFolder, "report");
        Directory.CreateDirectory(report);
        Directory.CreateSymbolicLink(Path.Combine(report, "plots"), folder.Outside);
        var run = CliRunner.Run("check", folder.Design(), "-q", "--report", report);
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.Contains("is a link, where a folder of the report is needed", run.Error);
        Assert.Empty(Directory.GetFileSystemEntries(folder.Outside));
        Assert.False(File.Exists(Path.Combine(report, "report.html")));
    }

    [Fact]
    public void When_one_output_is_refused_no_output_of_the_set_is_written()
    {
        var json = Path.Combine(folder.DesignFolder, "ok.json");
        var existing = folder.Write("existing.xml", "before");
        var run = CliRunner.Run("check", folder.Design(), "-q", "--json", json, "--junit", existing);
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.False(File.Exists(json));
        Assert.Equal("before", File.ReadAllText(existing));
        Assert.Empty(Directory.GetFiles(folder.DesignFolder, "*.tmp", SearchOption.AllDirectories));
    }

    [Fact]
    public void A_set_whose_content_cannot_be_rendered_writes_nothing_and_names_the_cause()
    {
        var first = Path.Combine(folder.DesignFolder, "first.json");
        var second = Path.Combine(folder.DesignFolder, "second.json");
        var set = new OutputSet(overwrite: false)
            .Add(first, () => "{}")
            .Add(second, () => System.Text.Json.JsonSerializer.Serialize(double.PositiveInfinity));
        var e = Assert.Throws<OutputRenderException>(() => set.Write());
        Assert.Equal(RenderFailure.NonFiniteFigure, e.Failure);
        Assert.Contains("not a finite number", e.Message);
        Assert.False(File.Exists(first));
        Assert.Equal(ExitCodes.SimulationFailed, ErrorReport.ExitCodeFor(e));
    }

    [Fact]
    public void Xml_that_cannot_carry_a_character_is_a_named_refusal_not_a_crash()
    {
        var set = new OutputSet(overwrite: false).Add(Path.Combine(folder.DesignFolder, "j.xml"), () =>
        {
            var text = new StringWriter();
            using (var xml = System.Xml.XmlWriter.Create(text)) xml.WriteElementString("name", "bell\u0007");
            return text.ToString();
        });
        var e = Assert.Throws<OutputRenderException>(() => set.Write());
        Assert.Equal(RenderFailure.UnwritableText, e.Failure);
        Assert.Equal(ExitCodes.BadInput, ErrorReport.ExitCodeFor(e));
    }

    [Fact]
    public void Temporary_files_are_created_only_while_the_set_is_written()
    {
        var path = Path.Combine(folder.DesignFolder, "a.txt");
        var seen = -1;
        new OutputSet(overwrite: false).Add(path, () =>
        {
            seen = Directory.GetFiles(folder.DesignFolder, "*.tmp").Length; // rendering happens before any file is created
            return "content";
        }).Write();
        Assert.Equal(0, seen);
        Assert.Equal("content", File.ReadAllText(path));
        Assert.Empty(Directory.GetFiles(folder.DesignFolder, "*.tmp"));
    }
}
