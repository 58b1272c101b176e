using System.Collections.Concurrent;
using ThermVerify.Limits;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

public sealed class WorstCaseProgressTests
{
    private sealed class Recorder : IProgress<RunProgress>
    {
        public ConcurrentQueue<RunProgress> Reports { get; } = new();
        public void Report(RunProgress value) => Reports.Enqueue(value);
    }

    /// <summary>
    /// Every unit the analysis evaluates is reported once: the nominal, two per tolerance for its sensitivity, each
    /// corner the sensitivities pick and, with few tolerances, all 2ⁿ corners; the last report says all are done.
    /// </summary>
    [Fact]
    public void Every_evaluated_unit_is_reported_and_the_run_ends_complete()
    {
        var recorder = new Recorder();
        var result = WorstCase.Run(ToleranceTestDesigns.TwoResistors(), new WorstCaseOptions { Threads = 2, Progress = recorder });
        var n = result.Parameters.Count;
        var expected = 1 + 2 * n + result.CornersEvaluated + (result.Enumeration?.Corners ?? 0);
        var reports = recorder.Reports.ToArray();
        Assert.Equal(expected, reports.Max(r => r.Done));
        Assert.Contains(new RunProgress(expected, expected), reports);
        Assert.All(reports, r => Assert.InRange(r.Done, 1, r.Total));
    }
}
