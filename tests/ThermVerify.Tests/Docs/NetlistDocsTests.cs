using ThermVerify.Tests.Cli;

namespace ThermVerify.Tests.Docs;

/// <summary>The walk-through of docs/netlists.md shows what the tool prints now (THERMVERIFY_REWRITE_DOCS=1 rewrites it).</summary>
public sealed class NetlistDocsTests : IDisposable
{
    private static string Page => Repository.PathOf("docs", "netlists.md");

    private readonly DirectoryInfo folder = Directory.CreateTempSubdirectory("tv-netlist-docs-");

    public void Dispose() => folder.Delete(recursive: true);

    private void Copy(string file) => File.Copy(Path.Combine(Repository.Netlists, file), Path.Combine(folder.FullName, file));

    private string Shown(string[] args, bool error = false)
    {
        var run = CliRunner.Run([.. args.Select((a, i) => i == 1 ? Path.Combine(folder.FullName, a) : a)]);
        var printed = (error ? run.Error : run.Output).Replace(folder.FullName + Path.DirectorySeparatorChar, "");
        return $"$ thermverify {string.Join(' ', args)}\n{printed}";
    }

    [Fact]
    public void The_walk_through_shows_the_netlist_the_check_its_worst_case_and_a_refusal()
    {
        Copy("boiler-flue-protected.cir");
        Copy("boiler-flue-protected.toml");
        DocBlocks.AssertCurrent(Page, "netlists-walkthrough-cir", File.ReadAllText(Path.Combine(Repository.Netlists, "boiler-flue-protected.cir")));
        DocBlocks.AssertCurrent(Page, "netlists-walkthrough-check", Shown(["check", "boiler-flue-protected.toml", "--no-remedies"]));
        DocBlocks.AssertCurrent(Page, "netlists-walkthrough-worstcase", Shown(["worstcase", "boiler-flue-protected.toml", "--threads", "2"]));
        var cir = Path.Combine(folder.FullName, "boiler-flue-protected.cir");
        File.WriteAllText(cir, File.ReadAllText(cir).Replace(".end", ".control\nshell rm -rf ~\n.endc\n.end"));
        DocBlocks.AssertCurrent(Page, "netlists-walkthrough-refused", Shown(["check", "boiler-flue-protected.toml"], error: true));
    }

    /// <summary>The switched excitation: the soil probe's netlist, and its check with the lead cut to 2 ms (an excerpt: the verdict and the settling finding).</summary>
    [Fact]
    public void The_switched_excitation_section_shows_the_pulse_and_a_short_lead_failing()
    {
        Copy("soil-probe-switched.cir");
        File.WriteAllText(Path.Combine(folder.FullName, "soil-probe-short-lead.toml"),
            File.ReadAllText(Path.Combine(Repository.Netlists, "soil-probe-switched-netlist.toml")).Replace("switch_on_lead = \"10 ms\"", "switch_on_lead = \"2 ms\""));
        DocBlocks.AssertCurrent(Page, "netlists-switched-cir", File.ReadAllText(Path.Combine(Repository.Netlists, "soil-probe-switched.cir")));
        var lines = Shown(["check", "soil-probe-short-lead.toml", "--no-remedies"]).Split('\n');
        var settling = Array.FindIndex(lines, l => l.Contains("settling: "));
        string[] excerpt =
        [
            lines[0], .. lines.Where(l => l.StartsWith("  netlist ") || l.StartsWith("FAIL:")), "...", .. lines[settling..(settling + 3)], "...",
        ];
        DocBlocks.AssertCurrent(Page, "netlists-switched-check", string.Join('\n', excerpt) + "\n");
    }
}
