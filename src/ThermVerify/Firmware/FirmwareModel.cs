using System.Globalization;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Sensors;

namespace ThermVerify.Firmware;

/// <summary>
/// What firmware needs to know to turn an ADC code into a temperature: the sensor, the divider around it,
/// the converter and the temperature range the table must cover.
/// </summary>
/// <param name="Range">Temperatures the table covers; must lie inside the sensor's valid range.</param>
/// <param name="LoadingCorrectionVolts">
/// Optional: the voltage the ADC node sits away from the unloaded divider (loaded minus unloaded), as a function
/// of the unloaded divider voltage. Null means an unloaded divider. The true temperature at a code then solves
/// V_unloaded + correction(V_unloaded) = code·Q.
/// </param>
public sealed record FirmwareModel(
    ISensorModel Sensor,
    SensorSide Side,
    double FixedOhms,
    double ExcitationVolts,
    AdcTransfer Adc,
    TemperatureRange Range,
    Func<double, double>? LoadingCorrectionVolts = null)
{
    /// <summary>
    /// A current through the sensor instead of a divider (null: a divider): the node is I·R_s and the firmware reads
    /// R_s = V/I. <see cref="FixedOhms"/> is then the reference resistor (or V_ref/I without one) and
    /// <see cref="ExcitationVolts"/> = I·<see cref="FixedOhms"/>; <see cref="Side"/> means nothing.
    /// </summary>
    public double? ExcitationAmperes { get; init; }

    /// <summary>
    /// A netlist front end ([netlist]): the node voltage is the netlist's ideal transfer (<see cref="NetlistTransfer"/>)
    /// instead of the divider formula, and <see cref="Side"/>, <see cref="FixedOhms"/> and <see cref="ExcitationVolts"/>
    /// are not used.
    /// </summary>
    internal NetlistSpec? Netlist { get; init; }

    /// <summary>
    /// A bridge ([bridge]): <see cref="Side"/>, <see cref="FixedOhms"/> and <see cref="ExcitationVolts"/> are the sensor's
    /// half and this is the opposite half at its nominal values; the node is V_d = V+ − V− (<see cref="BridgeFormula"/>),
    /// which a differential converter reads as a signed code.
    /// </summary>
    internal BridgeSpec? Bridge { get; init; }

    /// <summary>
    /// An amplifier between the bridge and the converter ([amplifier]), as the firmware takes it: the code reads its
    /// output G′·(V_d + V_os′) (<see cref="FirmwareAmplifier"/>); null: the converter reads V_d itself.
    /// </summary>
    internal FirmwareAmplifier? Amplifier { get; init; }

    /// <summary>The unloaded node voltage for a sensor resistance: the divider's output, I·R_s, a bridge's V_d or a netlist's ideal transfer.</summary>
    public double UnloadedVolts(double sensorOhms) =>
        Netlist is { } n ? NetlistTransfer.Of(n).OutputVolts(sensorOhms)
        : ExcitationAmperes is { } amps ? amps * sensorOhms
        : Bridge is { } b ? Amplified(BridgeFormula.OutputVolts(Side, ExcitationVolts, FixedOhms, b, sensorOhms))
        : DividerFormula.OutputVolts(Side, ExcitationVolts, sensorOhms, FixedOhms);

    /// <summary>The sensor resistance behind an unloaded node voltage: the divider's inverse, V/I, the bridge's or the netlist's (NaN where none gives it).</summary>
    public double SensorOhmsAt(double unloadedVolts) =>
        Netlist is { } n ? NetlistTransfer.Of(n).SensorOhms(unloadedVolts)
        : ExcitationAmperes is { } amps ? unloadedVolts / amps
        : Bridge is { } b ? BridgeFormula.SensorOhms(Side, ExcitationVolts, FixedOhms, b, Amplifier is { } a ? a.DifferentialVolts(unloadedVolts) : unloadedVolts)
        : DividerFormula.SensorOhms(Side, ExcitationVolts, unloadedVolts, FixedOhms);

    private double Amplified(double differentialVolts) => Amplifier is { } a ? a.OutputVolts(differentialVolts) : differentialVolts;

    /// <summary>Throws <see cref="FirmwareInputException"/> naming the first parameter that cannot make a table.</summary>
    public FirmwareModel Validated()
    {
        ArgumentNullException.ThrowIfNull(Sensor);
        if (ExcitationAmperes is { } amps && !(double.IsFinite(amps) && amps > 0))
            throw new FirmwareInputException(Invariant($"The excitation current is {amps} A; give a positive finite current."));
        if (Netlist is null && !(double.IsFinite(FixedOhms) && FixedOhms > 0))
            throw new FirmwareInputException(Invariant($"The fixed resistor is {FixedOhms} Ω; give a positive finite resistance."));
        if (Netlist is null && !(double.IsFinite(ExcitationVolts) && ExcitationVolts > 0))
            throw new FirmwareInputException(Invariant($"The excitation is {ExcitationVolts} V; give a positive finite voltage."));
        if (Bridge is { } b && !(double.IsFinite(b.HighOhms) && b.HighOhms > 0 && double.IsFinite(b.LowOhms) && b.LowOhms > 0))
            throw new FirmwareInputException(Invariant($"The bridge's opposite half is {b.HighOhms} Ω over {b.LowOhms} Ω; give positive finite resistances."));
        if (Amplifier is { } amp && !(double.IsFinite(amp.Gain) && amp.Gain > 0))
            throw new FirmwareInputException(Invariant($"The amplifier's gain is {amp.Gain}; give a positive finite gain."));
        if (Adc.Bits is < 1 or > 24)
            throw new FirmwareInputException(Invariant($"The ADC has {Adc.Bits} bits; firmware tables support 1 to 24 bits."));
        if (!(double.IsFinite(Adc.ReferenceVolts) && Adc.ReferenceVolts > 0))
            throw new FirmwareInputException(Invariant($"The ADC reference is {Adc.ReferenceVolts} V; give a positive finite voltage."));
        var valid = Sensor.ValidRange;
        if (!(Range.MinCelsius < Range.MaxCelsius) || !valid.Contains(Range.MinCelsius) || !valid.Contains(Range.MaxCelsius))
            throw new FirmwareInputException(
                $"The table range {Range} must be a non-empty interval inside the sensor's valid range {valid}; narrow the table range.");
        return this;
    }

    /// <summary>The voltage at the ADC node for a sensor at <paramref name="celsius"/>, with the loading correction if any.</summary>
    public double NodeVolts(double celsius)
    {
        var unloaded = UnloadedVolts(Sensor.ResistanceOhms(celsius));
        return LoadingCorrectionVolts is null ? unloaded : unloaded + LoadingCorrectionVolts(unloaded);
    }

    /// <summary>The same model with the sensor on the other side of the divider.</summary>
    public FirmwareModel WithOtherSide() => this with { Side = Side == SensorSide.Low ? SensorSide.High : SensorSide.Low };

    private static string Invariant(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}

/// <summary>Input that cannot make or check a firmware table; the message says what and how to fix it.</summary>
public sealed class FirmwareInputException(string message) : ArgumentException(message);
