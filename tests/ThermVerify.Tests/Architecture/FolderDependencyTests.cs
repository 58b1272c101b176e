namespace ThermVerify.Tests.Architecture;

/// <summary>
/// The floor plan DEVELOPERS.md states is the plan the code follows: every use of one folder by another goes down
/// the layers, never up, never sideways, and never along a forbidden pair. A failure names the file, the line and
/// the text that makes the arrow.
/// </summary>
public class FolderDependencyTests
{
    private static readonly FolderPlan Plan = FolderPlan.FromDevelopersGuide(File.ReadAllText(Repository.PathOf("DEVELOPERS.md")));

    private static IReadOnlyList<(string Path, string Text)> Sources(params string[] projects) =>
        [.. projects.SelectMany(p => Directory.EnumerateFiles(Repository.PathOf("src", p), "*.cs", SearchOption.AllDirectories))
            .Where(f => !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}") && !f.Contains($"{Path.DirectorySeparatorChar}bin{Path.DirectorySeparatorChar}"))
            .Select(f => (Path.GetRelativePath(Repository.Root, f), File.ReadAllText(f)))];

    [Fact]
    public void Every_use_of_another_folder_follows_the_plan()
    {
        var uses = FolderDependencies.Find(Sources("ThermVerify", "ThermVerify.Cli", "ThermVerify.Ngspice"));
        var broken = uses
            .Select(u => (Use: u, Why: Plan.Refusal(u.FromFolder, u.ToFolder)))
            .Where(x => x.Why is not null)
            .Select(x => $"{x.Use.File}:{x.Use.Line}: '{x.Use.Text}' makes {x.Use.FromFolder} use {x.Use.ToFolder}: {x.Why}")
            .ToList();
        Assert.True(broken.Count == 0, "Arrows the plan in DEVELOPERS.md forbids:\n" + string.Join("\n", broken));
        Assert.NotEmpty(uses); // the scan itself found the arrows that exist
    }

    [Fact]
    public void Every_folder_of_the_library_has_its_place_in_the_plan()
    {
        var folders = Directory.EnumerateDirectories(Repository.PathOf("src", "ThermVerify"))
            .Select(Path.GetFileName).Where(n => n is not ("bin" or "obj")).ToList();
        Assert.DoesNotContain(folders, f => !Plan.Layer.ContainsKey(f!));
        Assert.Empty(Directory.EnumerateFiles(Repository.PathOf("src", "ThermVerify"), "*.cs")); // no file outside a folder
    }

    [Fact]
    public void Every_file_lives_in_the_namespace_of_its_folder()
    {
        // The plan is checked by namespace, so a file may not borrow another folder's: src/ThermVerify/Check/Buffer/X.cs
        // is in ThermVerify.Check or below it (sub-folders may share their folder's namespace).
        var library = Repository.PathOf("src", "ThermVerify");
        var wrong = Sources("ThermVerify")
            .Select(s => (s.Path, Folder: Path.GetRelativePath(library, Repository.PathOf(s.Path)).Split(Path.DirectorySeparatorChar)[0],
                Namespace: System.Text.RegularExpressions.Regex.Match(SourceText.CodeOnly(s.Text), @"namespace\s+([\w.]+)\s*;").Groups[1].Value))
            .Where(s => s.Namespace != $"ThermVerify.{s.Folder}" && !s.Namespace.StartsWith($"ThermVerify.{s.Folder}.", StringComparison.Ordinal))
            .Select(s => $"{s.Path}: namespace '{s.Namespace}', expected ThermVerify.{s.Folder} or below")
            .ToList();
        Assert.True(wrong.Count == 0, string.Join("\n", wrong));
    }

    [Fact]
    public void Reports_never_reach_the_engines()
    {
        // Reporting may use FrontEnd's records (the ADC transfer, the waveform a check recorded) but none of its runners.
        string[] runners = ["SamplingRun", "SettlingGrid", "DcSweepCase", "FrontEndCircuit", "ICheckEngine", "BuiltInEngine", "FrontEndCheck", "Remedies"];
        var calls = Sources("ThermVerify")
            .Where(s => s.Path.Contains($"{Path.DirectorySeparatorChar}Reporting{Path.DirectorySeparatorChar}"))
            .SelectMany(s => SourceText.CodeOnly(s.Text).Split('\n').Select((line, i) => (s.Path, Line: i + 1, Text: line)))
            .Where(l => runners.Any(r => System.Text.RegularExpressions.Regex.IsMatch(l.Text, $@"(?<![\w.]){r}\b")))
            .Select(l => $"{l.Path}:{l.Line}: {l.Text.Trim()}")
            .ToList();
        Assert.True(calls.Count == 0, "Reporting reaches an engine:\n" + string.Join("\n", calls));
    }

    [Fact]
    public void The_scan_catches_an_arrow_the_plan_forbids()
    {
        // A made-up pair of files: a report that runs a simulation, and a circuit that reaches back into the check.
        var uses = FolderDependencies.Find(
        [
            ("src/a.cs", "using ThermVerify.Simulation;\nnamespace ThermVerify.Reporting;\nclass Plot { void M() { var x = Simulation.TransientRun.Go(); } }"),
            ("src/b.cs", "namespace ThermVerify.Simulation;\n// ThermVerify.Check in a comment is no arrow\nclass TransientRun { string s = \"ThermVerify.Check\"; }"),
            ("src/c.cs", "namespace ThermVerify.Circuits;\nclass Part { ThermVerify.Check.Finding f; }"),
            ("src/d.cs", "namespace ThermVerify.Check;\nclass Finding { }"),
        ]);
        Assert.Contains(uses, u => u is { FromFolder: "Reporting", ToFolder: "Simulation", Line: 1 });
        Assert.Contains(uses, u => u is { FromFolder: "Reporting", ToFolder: "Simulation", Line: 3 });
        Assert.Contains(uses, u => u is { FromFolder: "Circuits", ToFolder: "Check", Line: 2 });
        Assert.DoesNotContain(uses, u => u.FromFolder == "Simulation");
        Assert.NotNull(Plan.Refusal("Reporting", "Simulation"));
        Assert.NotNull(Plan.Refusal("Circuits", "Check"));
        Assert.Null(Plan.Refusal("Check", "Circuits"));
    }
}
