using ThermVerify.Components;
using ThermVerify.Design;
using ThermVerify.Reporting;
using ThermVerify.Tests.Tolerances;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Reporting;

/// <summary>
/// One Monte Carlo run, one worst case and one fixed-resistor search on the two-resistor test front end (10 kΩ NTC
/// ±1 %, fixed ±0.1 %, a single 1 K budget), shared by the analysis report tests.
/// </summary>
public sealed class AnalysisFixture
{
    public AnalysisFixture()
    {
        // A coarse 8-bit converter puts some units over budget, so that the yield is neither 0 nor 1; its declared
        // 0.1 LSB rms of noise takes a little of the budget (the 0.5 LSB assumed without it would take most of it).
        var design = ToleranceTestDesigns.TwoResistors(sensorTolerance: "\"3 %\"", bits: 8);
        Design = design with { Adc = design.Adc with { NoiseLsb = 0.1 } };
        MonteCarlo = ThermVerify.Tolerances.MonteCarlo.Run(Design, new MonteCarloOptions { Units = 400, Seed = 5, Threads = 2 });
        WorstCase = ThermVerify.Tolerances.WorstCase.Run(Design, new WorstCaseOptions { Threads = 2 });
        FixedOptions = new FixedResistorSearchOptions { Series = ESeries.E12, MinimumOhms = 3.3e3, MaximumOhms = 33e3, Threads = 2 };
        Fixed = FixedResistorSearch.Run(Design, FixedOptions);
        Reports =
        [
            MonteCarloReport.Build(MonteCarlo, Design, TestRun.Provenance, "test.toml"),
            WorstCaseReport.Build(WorstCase, Design, TestRun.Provenance, "test.toml"),
            FixedResistorReport.Build(Fixed, Design, FixedOptions, TestRun.Provenance, "test.toml"),
        ];
    }

    public FrontEndDesign Design { get; }
    public MonteCarloResult MonteCarlo { get; }
    public WorstCaseResult WorstCase { get; }
    public FixedResistorSearchOptions FixedOptions { get; }
    public IReadOnlyList<FixedResistorCandidate> Fixed { get; }
    public IReadOnlyList<AnalysisReport> Reports { get; }
}
