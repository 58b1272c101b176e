using ThermVerify.Design;
using ThermVerify.Simulation;

namespace ThermVerify.FrontEnd.DeltaSigma;

/// <summary>
/// A delta-sigma converter's DC levels with its input's average load: an unbuffered input as R_eq = 1/(f_mod·C) from
/// the pin to ground, a buffered one as its input current (<see cref="InputLoading.Average"/>), simulated on the
/// design's own circuit over the temperatures (a DC sweep with and without the load) and its shift of the pin added to
/// every level (superposition, exact for the linear DC circuit). The check and every unit of the tolerance analyses read their levels through it, so the
/// reported error carries the load that the input-loading finding shows, at every temperature.
/// </summary>
internal static class AverageInputLoad
{
    public static bool Applies(FrontEndDesign design) => design.Adc.Kind == ConverterKind.DeltaSigma;

    /// <summary>The levels moved by the load's simulated shift of the pin (the levels as they are for any other converter).</summary>
    /// <param name="builtInLevels">
    /// True where <paramref name="dc"/> is the built-in engine's sweep of the design's DC circuit: its base's static pin
    /// voltage is then the unloaded sweep this would run again (a Monte Carlo unit's, whose circuit holds no bound), so one
    /// sweep is saved. False for levels
    /// another engine may have swept (the check's), whose pin must not be mixed with the built-in engine's loaded one.
    /// </param>
    public static DcCorners Added(DcCorners dc, FrontEndDesign design, IReadOnlyList<double> temperatures, bool builtInLevels = false)
    {
        if (!Applies(design)) return dc;
        // The base levels are swept on the design with its bounds at zero: the same circuit only where it has none in it.
        var unloaded = builtInLevels && StaticBounds.InCircuit(design).Count == 0 ? dc.Base.StaticPinVolts : null;
        var shift = ShiftVolts(design, temperatures, unloaded);
        DcLevels Loaded(DcLevels l) => l with
        {
            StaticPinVolts = [.. l.StaticPinVolts.Select((v, i) => v + shift[i])],
            AveragePinVolts = [.. l.AveragePinVolts.Select(a => a.Select((v, i) => v + shift[i]).ToArray())],
        };
        var loaded = Loaded(dc.Base);
        return dc with { Base = loaded, Corners = [.. dc.Corners.Select(c => ReferenceEquals(c, dc.Base) ? loaded : Loaded(c))] };
    }

    /// <summary>
    /// The load's shift of the pin at every temperature: the design's swept DC circuit with and without the load, two
    /// sweeps (one factorisation pattern each, as every DC level is swept). A buffer whose offset drift a sweep cannot
    /// follow (<see cref="BufferStage.DriftFollowsSweep"/>) is solved at each temperature on a circuit built for it.
    /// </summary>
    /// <param name="unloadedPinVolts">The unloaded sweep's pin voltage where the caller has it from the built-in engine.</param>
    internal static double[] ShiftVolts(FrontEndDesign design, IReadOnlyList<double> temperatures, IReadOnlyList<double>? unloadedPinVolts = null)
    {
        var pin = FrontEndCircuit.PinNode(design);
        if (BufferStage.DriftFollowsSweep(design))
            return [.. temperatures.Select(t =>
                OperatingPoint.Solve(InputLoading.Average(design, t)).Voltage(pin) - OperatingPoint.Solve(FrontEndCircuit.Dc(design, null, t)).Voltage(pin))];
        var dc = FrontEndCircuit.Dc(design, null);
        var unloaded = unloadedPinVolts ?? DcSweep.Temperature(dc, temperatures).Voltage(pin);
        var loaded = DcSweep.Temperature(InputLoading.WithAverageLoad(design, dc), temperatures).Voltage(pin);
        return [.. loaded.Select((v, i) => v - unloaded[i])];
    }
}
