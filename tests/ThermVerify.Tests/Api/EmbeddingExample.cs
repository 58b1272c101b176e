namespace ThermVerify.Tests.Api;

/// <summary>The program docs/embedding.md shows, kept here so that it compiles and runs in the suite.</summary>
internal static class EmbeddingExample
{
    // example: begin
    public static int Run(string designPath, string jsonPath, TextWriter output)
    {
        var design = ThermVerify.Api.Verifier.LoadDesign(designPath);
        var run = ThermVerify.Api.Verifier.Check(design, new ThermVerify.Check.CheckOptions { ComputeRemedies = false });

        var worst = run.Result.Worst;
        output.WriteLine($"{design.Name}: {(run.Passed ? "pass" : "fail")}, worst {worst.ErrorKelvin:+0.000;-0.000} K at {worst.Celsius} °C");
        foreach (var finding in run.Result.Findings)
            output.WriteLine($"  {finding.Severity}: {finding.Id} ({finding.SizeKelvin:+0.000;-0.000} K)");

        var json = ThermVerify.Reporting.CheckJson.Write(run.Result, run.Provenance, Path.GetFileName(designPath)); // the same document as `check --json`
        File.WriteAllText(jsonPath, json);
        output.WriteLine($"{run.Result.Points.Count} temperatures checked; JSON in {Path.GetFileName(jsonPath)}");
        return run.Passed ? 0 : 1;
    }
    // example: end
}
