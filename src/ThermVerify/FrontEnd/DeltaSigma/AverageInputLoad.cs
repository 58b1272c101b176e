using ThermVerify.Design;
using ThermVerify.Simulation;

namespace ThermVerify.FrontEnd.DeltaSigma;

/// <summary>
/// A delta-sigma converter's DC levels with its input's average load: an unbuffered input as R_eq = 1/(f_mod·C) from
/// the pin to ground, a buffered one as its input current (<see cref="InputLoading.Average"/>), simulated on the
/// design's own circuit at every temperature and its shift of the pin added to every level (superposition, exact for
/// the linear DC circuit). The check and every unit of the tolerance analyses read their levels through it, so the
/// reported error carries the load that the input-loading finding shows, at every temperature.
/// </summary>
internal static class AverageInputLoad
{
    public static bool Applies(FrontEndDesign design) => design.Adc.Kind == ConverterKind.DeltaSigma;

    /// <summary>The levels moved by the load's simulated shift of the pin (the levels as they are for any other converter).</summary>
    public static DcCorners Added(DcCorners dc, FrontEndDesign design, IReadOnlyList<double> temperatures)
    {
        if (!Applies(design)) return dc;
        var pin = FrontEndCircuit.PinNode(design);
        var shift = temperatures.Select(t =>
            OperatingPoint.Solve(InputLoading.Average(design, t)).Voltage(pin) - OperatingPoint.Solve(FrontEndCircuit.Dc(design, null, t)).Voltage(pin)).ToArray();
        DcLevels Loaded(DcLevels l) => l with
        {
            StaticPinVolts = [.. l.StaticPinVolts.Select((v, i) => v + shift[i])],
            AveragePinVolts = [.. l.AveragePinVolts.Select(a => a.Select((v, i) => v + shift[i]).ToArray())],
        };
        var loaded = Loaded(dc.Base);
        return dc with { Base = loaded, Corners = [.. dc.Corners.Select(c => ReferenceEquals(c, dc.Base) ? loaded : Loaded(c))] };
    }
}
