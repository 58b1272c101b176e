using System.Text.Json;
using System.Text.Json.Nodes;
using System.Xml.Linq;
using ThermVerify.Design;
using ThermVerify.Provenance;
using ThermVerify.Tests.Cli;

namespace ThermVerify.Tests.Provenance;

/// <summary>
/// Every output names where it came from: the tool's version, the engine, the design by its digest and the settings
/// that change results; a baseline compared with a run made differently says how.
/// </summary>
public sealed class ProvenanceOutputTests : IDisposable
{
    private readonly DirectoryInfo folder = Directory.CreateTempSubdirectory("tv-provenance-");

    public ProvenanceOutputTests()
    {
        foreach (var name in new[] { "table-sensor-freezer.toml", "table-47k-rt.csv" })
            File.Copy(Path.Combine(Repository.Netlists, name), Path.Combine(folder.FullName, name));
    }

    private string Design => Path.Combine(folder.FullName, "table-sensor-freezer.toml");

    private string In(string name) => Path.Combine(folder.FullName, name);

    private DesignDigest Digest => DesignLoader.Load(Design).Source!;

    public void Dispose() => folder.Delete(recursive: true);

    [Fact]
    public void Check_names_tool_engine_design_and_settings_in_every_output()
    {
        var run = CliRunner.Run("check", Design, "--sampling-points", "3", "--no-remedies", "--json", In("c.json"), "--junit", In("j.xml"), "--report", In("r"));
        Assert.Equal(0, run.ExitCode);
        var digest = Digest;
        Assert.Contains($"  run      thermverify {ToolVersion.Current}, engine built-in; sampling-points 3, max-conversions 20000\n", run.Output);
        Assert.Contains($"  files    sha256 {digest.Sha256[..16]}… (table-sensor-freezer.toml, table-47k-rt.csv)\n", run.Output);

        var json = JsonNode.Parse(File.ReadAllText(In("c.json")))!["provenance"]!;
        Assert.Equal(ToolVersion.Current, (string?)json["tool"]!["version"]);
        Assert.Equal("built-in", (string?)json["engine"]!["name"]);
        Assert.Null(json["engine"]!["version"]);
        Assert.Equal(digest.Sha256, (string?)json["design"]!["sha256"]);
        Assert.Equal(digest.Files[1].Sha256, (string?)json["design"]!["files"]![1]!["sha256"]);
        Assert.Equal("3", (string?)json["settings"]!["sampling-points"]);

        var properties = XDocument.Load(In("j.xml")).Descendants("property").ToDictionary(p => (string)p.Attribute("name")!, p => (string)p.Attribute("value")!);
        Assert.Equal(ToolVersion.Current, properties["thermverify.version"]);
        Assert.Equal("built-in", properties["engine"]);
        Assert.Equal(digest.Sha256, properties["design.sha256"]);
        Assert.Equal("3", properties["setting.sampling-points"]);

        var html = File.ReadAllText(In(Path.Combine("r", "report.html")));
        var markdown = File.ReadAllText(In(Path.Combine("r", "report.md")));
        // Markdown escapes what a user wrote (file names) with backslashes, which it renders as the characters themselves.
        foreach (var page in new[] { html, markdown.Replace("\\", "") })
        {
            Assert.Contains($"sha256 {digest.Sha256} (table-sensor-freezer.toml, table-47k-rt.csv)", page);
            Assert.Contains($"thermverify {ToolVersion.Current}", page);
            Assert.Contains("sampling-points 3, max-conversions 20000", page);
        }
    }

    [Fact]
    public void A_baseline_keeps_its_provenance_and_a_check_made_differently_says_how()
    {
        Assert.Equal(0, CliRunner.Run("baseline", Design, "--out", In("b.json")).ExitCode);
        var stored = JsonNode.Parse(File.ReadAllText(In("b.json")))!;
        Assert.Equal(Digest.Sha256, (string?)stored["provenance"]!["design"]!["sha256"]);
        Assert.Equal("25", (string?)stored["provenance"]!["settings"]!["sampling-points"]);

        var same = CliRunner.Run("check", Design, "--no-remedies", "--baseline", In("b.json"));
        Assert.DoesNotContain("made differently", same.Output);

        var other = CliRunner.Run("check", Design, "--no-remedies", "--sampling-points", "3", "--baseline", In("b.json"), "--junit", In("j.xml"));
        Assert.Contains("the baseline was made differently, which alone may move figures: sampling-points: 25 then, 3 now", other.Output);
        Assert.Contains("sampling-points: 25 then, 3 now", File.ReadAllText(In("j.xml")));

        // A baseline from before provenance was recorded is still read, and the comparison says what it cannot tell.
        stored.AsObject().Remove("provenance");
        File.WriteAllText(In("old.json"), stored.ToJsonString());
        var old = CliRunner.Run("check", Design, "--no-remedies", "--quiet", "--baseline", In("old.json"));
        Assert.Contains("the baseline does not say which engine and settings made it", old.Output);
    }

    [Fact]
    public void A_baseline_whose_provenance_was_edited_is_refused_with_the_field()
    {
        Assert.Equal(0, CliRunner.Run("baseline", Design, "--out", In("b.json"), "--sampling-points", "3").ExitCode);
        var stored = JsonNode.Parse(File.ReadAllText(In("b.json")))!;
        stored["provenance"]!["design"]!["sha256"] = "0000";
        File.WriteAllText(In("b.json"), stored.ToJsonString());
        var run = CliRunner.Run("check", Design, "--no-remedies", "--quiet", "--baseline", In("b.json"));
        Assert.Equal(2, run.ExitCode);
        Assert.Contains("provenance.design.sha256 must be the hash of the files listed", run.Error);
    }

    [Fact]
    public void The_c_header_names_the_tool_the_design_files_and_the_settings()
    {
        Assert.Equal(0, CliRunner.Run("table", Design, "--header", In("t.h"), "--breakpoints", "12").ExitCode);
        var header = File.ReadAllText(In("t.h"));
        Assert.Contains($" * Made by: thermverify {ToolVersion.Current} (closed form; unit 0.01K, breakpoints 12, corrected no)\n", header);
        Assert.Contains($" * Design:  sha256 {Digest.Sha256} (table-sensor-freezer.toml, table-47k-rt.csv)\n", header);
    }

    [Fact]
    public void The_tolerance_analyses_name_their_settings_in_json_and_text()
    {
        var mc = CliRunner.Run("montecarlo", Design, "-n", "4", "--seed", "7", "--no-unit-settling", "--json", In("mc.json"));
        Assert.Equal(0, mc.ExitCode);
        Assert.Contains("engine built-in; units 4, seed 7, unit-settling nominal", mc.Output);
        var settings = JsonNode.Parse(File.ReadAllText(In("mc.json")))!["provenance"]!["settings"]!.AsObject();
        Assert.Equal(["units", "seed", "unit-settling", "max-conversions"], settings.Select(s => s.Key));

        var fixedRun = CliRunner.Run("choose-fixed", Design, "--series", "E6", "--min", "10k", "--max", "100k", "--objective", "resolution", "--json", In("f.json"));
        Assert.Equal(0, fixedRun.ExitCode);
        var doc = JsonDocument.Parse(File.ReadAllText(In("f.json"))).RootElement.GetProperty("provenance");
        Assert.Equal(Digest.Sha256, doc.GetProperty("design").GetProperty("sha256").GetString());
        Assert.Equal("resolution", doc.GetProperty("settings").GetProperty("objective").GetString());
        Assert.Equal("10000 ohm", doc.GetProperty("settings").GetProperty("min").GetString());
    }

    [Fact]
    public void Compare_names_each_design_by_its_files()
    {
        var other = In("freezer-copy.toml");
        File.WriteAllText(other, File.ReadAllText(Design).Replace("\nbudget = ", "\n# a changed copy\nbudget = ", StringComparison.Ordinal));
        var run = CliRunner.Run("compare", Design, other, "--no-remedies");
        Assert.Contains($"  run      thermverify {ToolVersion.Current}, engine built-in; sampling-points 25, max-conversions 20000\n", run.Output);
        Assert.Contains($"  files A  sha256 {Digest.Sha256[..16]}… (table-sensor-freezer.toml, table-47k-rt.csv)\n", run.Output);
        var copy = DesignLoader.Load(other).Source!;
        Assert.NotEqual(Digest.Sha256, copy.Sha256);
        Assert.Contains($"  files B  sha256 {copy.Sha256[..16]}… (freezer-copy.toml, table-47k-rt.csv)\n", run.Output);
    }

    [Theory]
    [InlineData("dc")]
    [InlineData("tran")]
    [InlineData("ac")]
    public void A_deck_names_the_tool_and_the_design_files_it_was_made_from(string analysis)
    {
        var run = CliRunner.Run("deck", Design, "--analysis", analysis);
        Assert.Equal(0, run.ExitCode);
        Assert.Contains($"\n* made by thermverify {ToolVersion.Current}; design files: sha256 {Digest.Sha256} (table-sensor-freezer.toml, table-47k-rt.csv)\n", run.Output);
    }
}
