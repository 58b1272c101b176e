using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.FrontEnd.DeltaSigma;
using ThermVerify.Simulation;

namespace ThermVerify.Tolerances;

/// <summary>
/// A unit read by a delta-sigma converter: its static reading, the settled output of the digital filter. The unit's
/// DC levels (its own circuit, swept as for any unit) carry the input's average load as the check's input-loading
/// analysis computes it: an unbuffered input as R_eq = 1/(f_mod·C) from the pin to ground, a buffered one as its input
/// current (InputLoading.Average), each simulated on the unit's own circuit at every temperature, and its shift of the
/// pin added to the unit's levels (superposition, exact for the linear DC circuit). The settling after a channel switch
/// is not rerun per unit (it is a transient through the digital filter at every temperature, costly for thousands of
/// units); the check reports the design's, and the outputs say so (<see cref="StaticReadingNote"/>).
/// </summary>
internal static class DeltaSigmaUnit
{
    public const string StaticReadingNote =
        "delta-sigma: each unit is read through the converter's static transfer (the settled filter output, the input's average load " +
        "R_eq = 1/(f_mod·C) or its buffer's input current simulated on the unit's own circuit); the settling after a channel switch is " +
        "not simulated per unit: `check` reports the design's";

    public static bool Applies(FrontEndDesign design) => design.Adc.Kind == ConverterKind.DeltaSigma;

    /// <summary>The unit's DC levels with the input's average load (<see cref="AverageInputLoad"/>, as the check reads them).</summary>
    public static DcCorners WithInputLoad(DcCorners dc, FrontEndDesign unit, IReadOnlyList<double> temperatures) =>
        AverageInputLoad.Added(dc, unit, temperatures);
}
