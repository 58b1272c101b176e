using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.FrontEnd.DeltaSigma;
using ThermVerify.Simulation;

namespace ThermVerify.Tolerances;

/// <summary>
/// A unit read by a delta-sigma converter: its static reading, the settled output of the digital filter. The unit's
/// DC levels (its own circuit, swept as for any unit) carry the input's average load as the check's input-loading
/// analysis computes it: an unbuffered input as R_eq = 1/(f_mod·C) from the pin to ground, a buffered one as its input
/// current (AverageInputLoad, as the check reads them), each simulated on the unit's own circuit at every temperature, and its shift of the
/// pin added to the unit's levels (superposition, exact for the linear DC circuit). In `montecarlo` (unless
/// --no-unit-settling) each unit's first reading used after a channel switch (and after the excitation's switch-on
/// where the divider is switched) is simulated with its own parts through the digital filter, as `check` simulates the
/// design's (ChannelSettling), at one temperature: where the nominal unit's is worst against the budget of the three the
/// check follows. Its error in K counts against the budget there as the check's channel-switch finding does (a unit
/// over it is not within the budget), and is reported beside the static errors, not added to them (a reading is either
/// the first after a switch or a settled one). `worstcase` keeps the static reading (its corners and sensitivities are
/// static, as for a successive-approximation converter), and the outputs say so (<see cref="StaticReadingNote"/>).
/// </summary>
internal static class DeltaSigmaUnit
{
    public const string StaticReadingNote =
        "delta-sigma: each unit is read through the converter's static transfer (the settled filter output, the input's average load " +
        "R_eq = 1/(f_mod·C) or its buffer's input current simulated on the unit's own circuit); the settling after a channel switch is " +
        "not simulated per unit: `check` reports the design's";

    /// <summary>What a Monte Carlo run with each unit's own channel switch says beside its static readings.</summary>
    public static string SwitchNote(UnitChannelSwitch s) => string.Create(System.Globalization.CultureInfo.InvariantCulture,
        $"delta-sigma: each unit is read through the converter's static transfer (the settled filter output, the input's average load " +
        $"R_eq = 1/(f_mod·C) or its buffer's input current simulated on the unit's own circuit); its first reading used after a channel switch " +
        $"is simulated with its own parts through the digital filter at {s.Celsius:0.##} °C and judged against the budget there " +
        $"({s.BudgetKelvin:0.###} K): nominal {s.NominalKelvin:0.####} K, worst unit {s.WorstKelvin:0.####} K, {s.UnitsOver} of {s.Units} units over");

    public static bool Applies(FrontEndDesign design) => design.Adc.Kind == ConverterKind.DeltaSigma;

    /// <summary>
    /// The temperature a unit's channel switch is simulated at: of the three the check follows (the range's ends and
    /// middle), where the nominal unit's first reading used is worst against the budget (the check's own choice).
    /// </summary>
    public static double SwitchCelsius(FrontEndDesign nominalUnit, ClosedFormModel model)
    {
        var range = nominalUnit.Check.Range;
        double[] candidates = [.. new[] { range.MinCelsius, (range.MinCelsius + range.MaxCelsius) / 2, range.MaxCelsius }.Distinct()];
        return candidates.MaxBy(t => SwitchKelvin(nominalUnit, t, model) / nominalUnit.Check.BudgetAt(t));
    }

    /// <summary>
    /// The unit's first reading used after a channel switch (or the switch-on, whichever is worse) at one temperature,
    /// its error against its own settled reading in K through the firmware's nominal slope.
    /// </summary>
    public static double SwitchKelvin(FrontEndDesign unit, double celsius, ClosedFormModel model) =>
        Check.DeltaSigma.DeltaSigmaFindings.Starts(unit)
            .Max(s => Math.Abs(ChannelSettling.At(unit, celsius, BuiltInEngine.Instance, s, trace: false).FirstUsedErrorVolts / model.At(celsius).VoltsPerKelvin));

}

/// <summary>
/// The units' first readings used after a channel switch, simulated with each unit's own parts at one temperature:
/// the budget there, the nominal unit's error, the largest of any unit and how many units it puts over the budget.
/// </summary>
public sealed record UnitChannelSwitch(double Celsius, double BudgetKelvin, double NominalKelvin, double WorstKelvin, int UnitsOver, int Units);
