using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation;

/// <summary>
/// DC sweeps. Each point starts Newton from the previous point's solution (continuation); a linear circuit
/// costs one LU and one substitution per point, with only the temperature- or value-dependent stamps
/// restamped. A point Newton cannot reach directly is approached in halved steps, then with gmin and source
/// stepping; <see cref="DcSweepResult.Notes"/> lists every point that needed an aid.
/// </summary>
internal static class DcSweep
{
    public const string TemperatureAnalysisName = "DC temperature sweep";
    public const string ElementAnalysisName = "DC sweep";

    /// <summary>Sweeps the circuit temperature; every temperature-dependent element follows, as SPICE's
    /// <c>.dc temp</c> does.</summary>
    public static DcSweepResult Temperature(Circuit circuit, IReadOnlyList<double> temperaturesCelsius)
    {
        foreach (var t in temperaturesCelsius)
            Circuit.CheckTemperature(t);
        TopologyCheck.Run(circuit);
        var system = new BoundSystem(circuit);
        return Run(system, temperaturesCelsius, TemperatureAnalysisName, "temperature (°C)",
            (s, t) => s.SetTemperature(t));
    }

    /// <summary>Sweeps the main value of one element (a source's DC value, a resistance) at the circuit temperature.</summary>
    public static DcSweepResult Element(Circuit circuit, string elementName, IReadOnlyList<double> values)
    {
        TopologyCheck.Run(circuit);
        var system = new BoundSystem(circuit);
        var stamp = system.StampOf(elementName);
        var quantity = stamp.SweepQuantity
            ?? throw new CircuitException($"{stamp.Element.Describe} has no single value a DC sweep can vary; sweep a source or a resistor.");
        system.MarkVarying(stamp);
        return Run(system, values, ElementAnalysisName, $"{elementName} {quantity}",
            (s, v) => s.SetSweepValue(stamp, v));
    }

    private static DcSweepResult Run(BoundSystem system, IReadOnlyList<double> values, string analysis, string parameter,
        Action<BoundSystem, double> set)
    {
        var width = system.Layout.VectorLength;
        var data = new double[values.Count * width];
        var warnings = new Warnings(system);
        var notes = new List<SolverNote>();
        var saved = new double[width];
        double? previous = null;
        for (var p = 0; p < values.Count; p++)
        {
            var aid = SolvePoint(system, previous, values[p], analysis, set, saved);
            if (aid != ConvergenceAid.None)
                notes.Add(new SolverNote(analysis, $"{analysis} at {values[p]:G6}: converged with {Describe(aid)}", aid, values[p]));
            previous = values[p];
            Array.Copy(system.Context.Solution, 0, data, p * width, width);
            warnings.Check(sweepValue: values[p]);
        }
        return new DcSweepResult(system, parameter, [.. values], data, warnings.Found) { Notes = notes };
    }

    internal static string Describe(ConvergenceAid aid) => aid switch
    {
        ConvergenceAid.SweepStepHalving => "the sweep step halved (continuation from the previous point)",
        ConvergenceAid.GminStepping => "gmin stepping",
        ConvergenceAid.SourceStepping => "source stepping",
        _ => "plain Newton",
    };

    /// <summary>Largest number of halvings of the step from the previous point before the full aids take over.</summary>
    private const int MaxHalvings = 12;

    /// <summary>
    /// Continuation: Newton from the previous point's solution. If it fails, the sweep walks from the previous value
    /// towards this one in steps halved until Newton follows (doubled again after each success), at most
    /// <see cref="MaxHalvings"/> times; a point still out of reach gets gmin and source stepping
    /// (<see cref="DcSolver"/>). The first point starts with the full DC solver.
    /// </summary>
    /// <param name="saved">Scratch for the last good solution (one per sweep: a point allocates nothing).</param>
    private static ConvergenceAid SolvePoint(BoundSystem system, double? previous, double target, string analysis,
        Action<BoundSystem, double> set, double[] saved)
    {
        var c = system.Context;
        set(system, target);
        if (previous is not { } from)
            return DcSolver.Solve(system, analysis, target);
        Array.Copy(c.Solution, saved, saved.Length);
        SingularMatrixException? singular = null;
        if (DcSolver.Attempt(system, ref singular, out _))
        {
            CheckConditioning(system, analysis, target);
            return ConvergenceAid.None;
        }
        var reached = 0.0;
        var step = 0.5;
        var halvings = 1;
        while (halvings <= MaxHalvings)
        {
            Array.Copy(saved, c.Solution, saved.Length);
            var fraction = Math.Min(1, reached + step);
            set(system, fraction >= 1 ? target : from + fraction * (target - from));
            if (DcSolver.Attempt(system, ref singular, out _))
            {
                reached = fraction;
                Array.Copy(c.Solution, saved, saved.Length);
                if (reached >= 1)
                {
                    CheckConditioning(system, analysis, target);
                    return ConvergenceAid.SweepStepHalving;
                }
                step *= 2;
                continue;
            }
            step /= 2;
            halvings++;
        }
        Array.Copy(saved, c.Solution, saved.Length);
        set(system, target);
        return DcSolver.Solve(system, analysis, target);
    }

    // The place is put into words only when the check fails: formatting it at every point cost more than the solve.
    private static void CheckConditioning(BoundSystem system, string analysis, double target)
    {
        if (system.IsIllConditioned)
            throw system.IllConditioned(analysis, $" at sweep value {target:G6}");
    }
}
