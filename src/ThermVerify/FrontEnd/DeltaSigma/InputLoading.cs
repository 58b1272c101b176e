using ThermVerify.Circuits;
using ThermVerify.Design;
using ThermVerify.Simulation;

namespace ThermVerify.FrontEnd.DeltaSigma;

/// <summary>
/// What a delta-sigma converter's input draws from the front end, three ways side by side at one temperature.
/// Unbuffered: every modulator period T = 1/f_mod the sampling capacitance C joins the pin for the first half and is
/// emptied into the modulator (to 0 V) in the second, so the pin gives C·V each period: on average a resistor
/// R_eq = 1/(f_mod·C) to ground (the switched-capacitor resistor; D. Johns, K. Martin, Analog Integrated Circuit
/// Design, 1997, switched-capacitor chapter, from memory). (1) The switched transient: the design's DC circuit with
/// the two switches and the capacitor, its periodic steady state propagated exactly by the built-in engine (any engine
/// can run it); the converter takes what C holds when it leaves the pin. (2) The average: the DC circuit with R_eq
/// at the pin. (3) The closed form: V_th·R_eq/(R_s + R_eq) from the pin's Thévenin source V_th, R_s. With a reservoir
/// much larger than C the three agree; with none the capacitor charges to V_th within each half period and the
/// error vanishes; in between, each period's charge sharing is what the switched run shows and the average does not.
/// Buffered: the pin sees the buffer's input current I alone, an error of −I·R_s, simulated as a current source.
/// </summary>
internal static class InputLoading
{
    public const string InputSwitch = "Sds_in";
    public const string EmptySwitch = "Sds_empty";
    public const string InputCapacitor = "Cds_in";
    public const string InputNode = "ds_in";
    public const string AverageResistor = "Rds_eq";
    public const string BufferCurrent = "Ids_in";

    /// <summary>The input switch charges C with a time constant of this fraction of its half period: e^−100 of it is left.</summary>
    private const double TimeConstantsPerHalfPeriod = 100;

    /// <summary>R_eq = 1/(f_mod·C): the average resistance of the unbuffered input.</summary>
    public static double EquivalentOhms(DeltaSigmaSpec d) => 1 / (d.ModulatorRateHertz * d.SamplingCapacitanceFarads);

    /// <summary>
    /// The closed form of the load's shift of the pin: buffered, −I·R_s (Ohm's law); unbuffered, R_eq divides the pin's
    /// Thévenin source, −V·R_s/(R_s + R_eq) (Johns &amp; Martin).
    /// </summary>
    public static double ClosedFormShiftVolts(DeltaSigmaSpec d, double unloadedVolts, double sourceOhms) =>
        d.InputBuffered ? -d.InputCurrentAmperes * sourceOhms : -unloadedVolts * sourceOhms / (sourceOhms + EquivalentOhms(d));

    /// <summary>The resistance the pin is driven through: the sensor side's Thévenin resistance (or a buffer's isolation resistor) and the filter's series resistor.</summary>
    public static double SourceOhms(FrontEndDesign design, ClosedFormPoint point) =>
        (design.Buffer is { } b ? b.IsolationResistorOhms : point.TheveninOhms) + design.Filter.SeriesResistorOhms;

    /// <summary>The switch-on resistance of the input: C charges within a small part of its half period.</summary>
    public static double SwitchOhms(DeltaSigmaSpec d) => 1 / (2 * d.ModulatorRateHertz * TimeConstantsPerHalfPeriod * d.SamplingCapacitanceFarads);

    /// <summary>
    /// The design's DC circuit with the unbuffered input's two switches and capacitor (periodic, one modulator period),
    /// their schedules starting <paramref name="delaySeconds"/> late, and any <paramref name="more"/> elements after them
    /// (the circuit made once, not element by element: a Monte Carlo unit builds it for every channel switch).
    /// </summary>
    public static Circuit Switched(FrontEndDesign design, double celsius, int? periods = null, double delaySeconds = 0, IEnumerable<Element>? more = null)
    {
        var d = Spec(design);
        if (d.InputBuffered) throw new ArgumentException("A buffered input draws no switched current.", nameof(design));
        var period = 1 / d.ModulatorRateHertz;
        var on = SwitchOhms(d);
        var dc = FrontEndCircuit.Dc(design, null, celsius);
        Element[] input =
        [
            new TimedSwitch(InputSwitch, FrontEndCircuit.PinNode(design), InputNode, on, FrontEndCircuit.SwitchOffOhms,
                new PeriodicSchedule(delaySeconds, period, period / 2, periods)),
            new TimedSwitch(EmptySwitch, InputNode, Circuit.Ground, on, FrontEndCircuit.SwitchOffOhms,
                new PeriodicSchedule(period / 2 + delaySeconds, period, period / 2, periods)),
            new Capacitor(InputCapacitor, InputNode, Circuit.Ground, d.SamplingCapacitanceFarads),
        ];
        return new Circuit([.. dc.Elements, .. input, .. more ?? []], dc.TemperatureCelsius);
    }

    /// <summary>The design's DC circuit with the input's average load: R_eq to ground (unbuffered) or the buffer's input current.</summary>
    public static Circuit Average(FrontEndDesign design, double celsius) => WithAverageLoad(design, FrontEndCircuit.Dc(design, null, celsius));

    /// <summary>A DC circuit of the design (at one temperature or swept) with the input's average load at the pin.</summary>
    public static Circuit WithAverageLoad(FrontEndDesign design, Circuit dc)
    {
        var d = Spec(design);
        var pin = FrontEndCircuit.PinNode(design);
        return d.InputBuffered
            ? dc.Add(new CurrentSource(BufferCurrent, pin, Circuit.Ground, new DcWaveform(d.InputCurrentAmperes)))
            : dc.Add(new Resistor(AverageResistor, pin, Circuit.Ground, EquivalentOhms(d)));
    }

    /// <summary>The three views of the input's load at one temperature.</summary>
    public static InputLoad At(FrontEndDesign design, double celsius, ICheckEngine engine)
    {
        var d = Spec(design);
        var point = new ClosedFormModel(design).At(celsius);
        var pin = FrontEndCircuit.PinNode(design);
        var unloaded = OperatingPoint.Solve(FrontEndCircuit.Dc(design, null, celsius)).Voltage(pin);
        var average = OperatingPoint.Solve(Average(design, celsius)).Voltage(pin);
        var source = SourceOhms(design, point);
        var closedForm = unloaded + ClosedFormShiftVolts(d, unloaded, source);
        if (d.InputBuffered)
            return new InputLoad(celsius, true, unloaded, average, average, closedForm, double.PositiveInfinity, source);
        var run = engine.StartTransient(Switched(design, celsius), new TransientOptions { StopTimeSeconds = 1 / d.ModulatorRateHertz });
        var switched = run.TryPeriodicSteadyState(InputSwitch, InputNode, out var steady) ? steady : SteppedSteadyState(design, celsius, engine);
        return new InputLoad(celsius, false, unloaded, switched, average, closedForm, EquivalentOhms(d), source);
    }

    /// <summary>
    /// For an engine without exact propagation: the switched run over enough periods for the front end to settle
    /// (20 time constants of the pin's source into its capacitance and R_eq), read as C leaves the pin.
    /// </summary>
    private static double SteppedSteadyState(FrontEndDesign design, double celsius, ICheckEngine engine)
    {
        var d = Spec(design);
        var point = new ClosedFormModel(design).At(celsius);
        var source = SourceOhms(design, point);
        var r = source * EquivalentOhms(d) / (source + EquivalentOhms(d));
        var tau = r * (design.Filter.ReservoirCapacitorFarads + design.Adc.PinCapacitanceFarads + d.SamplingCapacitanceFarads);
        var period = 1 / d.ModulatorRateHertz;
        var periods = (int)Math.Min(int.MaxValue, Math.Ceiling(20 * tau / period) + 4);
        SteppedPeriods.Check(periods, design);
        var t = (periods - 1 + 0.5) * period;
        var run = engine.StartTransient(Switched(design, celsius), new TransientOptions { StopTimeSeconds = t, MaxStepSeconds = period / 20 });
        return run.VoltageAt(t, InputNode);
    }

    private static DeltaSigmaSpec Spec(FrontEndDesign design) =>
        design.Adc.DeltaSigma ?? throw new ArgumentException($"{design.Name} has no delta-sigma converter.", nameof(design));
}

/// <summary>
/// Time stepping through a delta-sigma input takes about 20 steps a modulator period: more periods than
/// --max-conversions allows are refused with the way round (the built-in engine propagates a linear front end exactly).
/// </summary>
internal static class SteppedPeriods
{
    public static void Check(long periods, FrontEndDesign design)
    {
        var limit = Limits.Work.Limits.MaximumConversions;
        if (periods <= limit) return;
        throw new EngineUnsupportedException(
            $"{design.Name}: the delta-sigma input would have to be time-stepped through {periods} modulator periods, more than the limit of {limit} " +
            "(--max-conversions): the engine cannot propagate this front end exactly (a nonlinear part, or another engine). " +
            "Use the built-in engine on a linear front end, or raise --max-conversions.");
    }
}

/// <summary>
/// The input's load at one temperature: the pin unloaded, what the converter takes with the switched input (its periodic
/// steady state), the average-resistor model, the closed form, and R_eq and R_s behind them (volts at the pin).
/// </summary>
public sealed record InputLoad(double Celsius, bool Buffered, double UnloadedVolts, double SwitchedVolts, double AverageVolts,
    double ClosedFormVolts, double EquivalentOhms, double SourceOhms)
{
    /// <summary>The error the load makes in what the converter takes.</summary>
    public double ErrorVolts => SwitchedVolts - UnloadedVolts;
}
