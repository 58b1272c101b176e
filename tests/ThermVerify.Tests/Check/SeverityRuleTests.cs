using ThermVerify.Check;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Check;

/// <summary>
/// The severity rule of docs/methods.md, section 9, restated here and held against every finding of every example: an
/// effect is a finding where it exceeds ½ LSB; it fails when its own contribution exceeds the budget at some
/// temperature, and warns otherwise, whatever the other effects at that temperature do.
/// </summary>
public class SeverityRuleTests
{
    /// <summary>Each error column by the name of the finding it belongs to (shared with the error-split tests).</summary>
    internal static readonly Dictionary<string, Func<ErrorContributions, double>> Columns = new()
    {
        ["converter"] = c => c.ConverterKelvin,
        ["dc-loading"] = c => c.DcLoadingKelvin,
        ["reservoir-recovery"] = c => c.RecoveryKelvin,
        ["settling"] = c => c.SettlingKelvin,
        ["buffer-static"] = c => c.BufferKelvin,
        ["self-heating"] = c => c.SelfHeatingKelvin,
    };

    [Theory]
    [MemberData(nameof(ExampleDesigns.All), MemberType = typeof(ExampleDesigns))]
    public void A_findings_severity_is_its_own_size_against_the_budget(string example)
    {
        var design = ExampleDesigns.Load(example);
        var result = FrontEndCheck.Run(design with { Check = design.Check with { StepKelvin = (design.Check.Range.MaxCelsius - design.Check.Range.MinCelsius) / 8 } },
            new CheckOptions { ComputeRemedies = false, MaximumSamplingPoints = 3 });
        foreach (var f in result.Findings.Where(f => Columns.ContainsKey(f.Id)))
        {
            var fails = result.Points.Any(p => Math.Abs(Columns[f.Id](p.Contributions)) > p.BudgetKelvin);
            Assert.Equal(fails ? Severity.Fail : Severity.Warn, f.Severity);
        }
        Assert.Equal(result.Points.Any(p => !p.WithinBudget), result.Findings.Any(f => f.Id == "over-budget" && f.Severity == Severity.Fail));
    }

    [Fact]
    public void A_small_effect_stays_a_warning_where_another_one_breaks_the_budget()
    {
        // The unbuffered cold-storage logger: settling breaks the budget everywhere, while its DC loading (leakage through
        // the divider, a few hundredths of a kelvin) is far inside it: a warning, not a failure.
        var result = FrontEndCheck.Run(ExampleDesigns.Load("cold-storage-logger.toml"), new CheckOptions { ComputeRemedies = false, MaximumSamplingPoints = 5 });
        Assert.Equal(Severity.Fail, result.Findings.Single(f => f.Id == "settling").Severity);
        var loading = result.Findings.Single(f => f.Id == "dc-loading");
        Assert.Equal(Severity.Warn, loading.Severity);
        Assert.True(Math.Abs(loading.SizeKelvin) < 0.1, $"{loading.SizeKelvin} K");
    }
}
