using System.Numerics;
using ThermVerify.Check;
using ThermVerify.Check.Remedies;
using ThermVerify.Circuits;
using ThermVerify.FrontEnd;
using ThermVerify.Simulation;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// The run-wide memo of simulations (MemoizingEngine): a netlist simulated again gives back what was recorded, and
/// every run gets exactly the numbers an uncached run making the same reads would get. The reference is the built-in
/// engine itself, run without the memo.
/// </summary>
public class MemoizingEngineTests
{
    /// <summary>Counts what reaches the engine behind the memo.</summary>
    private sealed class CountingEngine : ICheckEngine
    {
        public int Sweeps, Transients, Reads;

        public string Name => "counting";

        IReadOnlyList<double[]> ICheckEngine.TemperatureSweep(Circuit circuit, IReadOnlyList<double> temperaturesCelsius, IReadOnlyList<string> nodes)
        {
            Sweeps++;
            return BuiltInEngine.Instance.TemperatureSweep(circuit, temperaturesCelsius, nodes);
        }

        ISampledTransient ICheckEngine.StartTransient(Circuit circuit, TransientOptions options)
        {
            Transients++;
            return new Counted(this, BuiltInEngine.Instance.StartTransient(circuit, options));
        }

        (double[] FrequenciesHertz, Complex[][] Volts) ICheckEngine.AcSweep(Circuit circuit, double startHertz, double stopHertz, int pointsPerDecade,
            IReadOnlyList<string> nodes) => BuiltInEngine.Instance.AcSweep(circuit, startHertz, stopHertz, pointsPerDecade, nodes);

        (double[] FrequenciesHertz, double[] VoltsPerRootHertz) ICheckEngine.NoiseSweep(Circuit circuit, string node, string inputSource,
            double startHertz, double stopHertz, int pointsPerDecade) =>
            BuiltInEngine.Instance.NoiseSweep(circuit, node, inputSource, startHertz, stopHertz, pointsPerDecade);

        private sealed class Counted(CountingEngine owner, ISampledTransient run) : ISampledTransient
        {
            public double VoltageAt(double timeSeconds, string node)
            {
                owner.Reads++;
                return run.VoltageAt(timeSeconds, node);
            }
        }
    }

    [Fact]
    public void The_same_netlist_built_twice_is_simulated_once()
    {
        var design = ExampleDesigns.Load("cold-storage-logger.toml");
        var counting = new CountingEngine();
        var memo = MemoizingEngine.Wrap(counting);
        double[] temperatures = [-30, 0, 20];
        var first = memo.TemperatureSweep(FrontEndCircuit.Dc(design, 0.0), temperatures, [FrontEndNodes.Divider]);
        var second = memo.TemperatureSweep(FrontEndCircuit.Dc(design, 0.0), temperatures, [FrontEndNodes.Divider]);
        Assert.Equal(1, counting.Sweeps);
        Assert.Equal(first[0], second[0]);
        second[0][0] = double.NaN; // a caller's copy is its own
        Assert.Equal(first[0], memo.TemperatureSweep(FrontEndCircuit.Dc(design, 0.0), temperatures, [FrontEndNodes.Divider])[0]);

        // Another value anywhere is another netlist.
        var other = design with { Adc = design.Adc with { PinLeakageAmperes = design.Adc.PinLeakageAmperes + 1e-9 } };
        memo.TemperatureSweep(FrontEndCircuit.Dc(other, 0.0), temperatures, [FrontEndNodes.Divider]);
        Assert.Equal(2, counting.Sweeps);
    }

    [Fact]
    public void A_transient_is_replayed_while_its_reads_match_and_simulated_exactly_as_uncached_from_the_first_that_does_not()
    {
        var design = ExampleDesigns.Load("cold-storage-logger-buffered.toml");
        var (circuit, options) = SamplingRun.Setup(design, -30, 0.0, 1e-6, 6);
        var times = Enumerable.Range(0, 6).Select(k => FrontEndCircuit.SampleTimeSeconds(design, k)).ToArray();
        var counting = new CountingEngine();
        var memo = MemoizingEngine.Wrap(counting);

        var a = memo.StartTransient(circuit, options);
        var recorded = times.Take(4).Select(t => a.VoltageAt(t, FrontEndNodes.Hold)).ToArray();
        var readsAfterFirst = counting.Reads;

        var (again, _) = SamplingRun.Setup(design, -30, 0.0, 1e-6, 6); // built anew: the same content
        var b = memo.StartTransient(again, options);
        Assert.Equal(recorded, times.Take(4).Select(t => b.VoltageAt(t, FrontEndNodes.Hold)));
        Assert.Equal(1, counting.Transients);
        Assert.Equal(readsAfterFirst, counting.Reads);

        // Reads past the record (and a run that skips one) give what a run without the memo gives for the same reads.
        var beyond = b.VoltageAt(times[5], FrontEndNodes.Hold);
        var plain = BuiltInEngine.Instance.StartTransient(circuit, options);
        foreach (var t in times.Take(4)) plain.VoltageAt(t, FrontEndNodes.Hold);
        Assert.Equal(plain.VoltageAt(times[5], FrontEndNodes.Hold), beyond);

        var skipping = memo.StartTransient(circuit, options);
        var plainSkipping = BuiltInEngine.Instance.StartTransient(circuit, options);
        Assert.Equal(plainSkipping.VoltageAt(times[1], FrontEndNodes.Hold), skipping.VoltageAt(times[1], FrontEndNodes.Hold));
        Assert.Equal(plainSkipping.VoltageAt(times[3], FrontEndNodes.Hold), skipping.VoltageAt(times[3], FrontEndNodes.Hold));
    }

    /// <summary>
    /// A remedy's proof: the design with the converter's offset calibrated out has the same analog front end, so through
    /// a memo warmed by the design itself its check must be the one a fresh engine gives.
    /// </summary>
    [Fact]
    public void A_check_through_a_warm_memo_equals_the_check_through_a_fresh_engine()
    {
        var design = ExampleDesigns.Load("cold-storage-logger-buffered.toml");
        var changed = Knobs.AdcOffset.Apply(design, 0);
        var memo = MemoizingEngine.Wrap(BuiltInEngine.Instance);
        var options = new CheckOptions { ComputeRemedies = false, Engine = memo };
        FrontEndCheck.Run(design, options);
        var warm = FrontEndCheck.Run(changed, options);
        var fresh = FrontEndCheck.Run(changed, options with { Engine = BuiltInEngine.Instance });
        Assert.Equal(fresh.Points.Select(p => p.ErrorKelvin), warm.Points.Select(p => p.ErrorKelvin));
        Assert.Equal(fresh.Points.Select(p => p.SampleVolts), warm.Points.Select(p => p.SampleVolts));
        Assert.Equal(fresh.Findings.Select(f => f.Id + f.WorstCelsius), warm.Findings.Select(f => f.Id + f.WorstCelsius));
    }
}
