namespace ThermVerify.Design;

/// <summary>
/// How the sensor is wired to the board (with a current source): 2 wires (both leads in series with the sensor), 3 wires
/// (a second, matched current through the third lead cancels the first lead at the converter's negative input) or 4
/// wires (the current on one pair, the converter on the other, whose leads carry only its input current). Each lead has
/// the same resistance and tempco and sits at the leads' own temperature. In a bridge ([bridge]) 3 wires put the leads
/// in the bridge's arms instead: one in the sensor's arm, one in the adjacent (fixed resistor's) arm and the third in
/// the sense line to V+, so the leads cancel to first order; <see cref="LeadMismatch"/> is what is left.
/// </summary>
public sealed record WiringSpec
{
    public required int Wires { get; init; }
    /// <summary>Each wire's resistance at 25 °C.</summary>
    public required double LeadOhms { get; init; }
    /// <summary>Fraction per kelvin; copper by default.</summary>
    public double LeadTempcoPerKelvin { get; init; } = DesignDefaults.CopperTempcoPerKelvin;
    /// <summary>Null: the leads sit at the board temperature (the swept one without a board temperature).</summary>
    public double? LeadCelsius { get; init; }
    /// <summary>3 wires: the second current is I·(1 + mismatch).</summary>
    public double CurrentMismatch { get; init; }
    /// <summary>Written with a sign: taken at that sign; without one the mismatch is a bound (<see cref="SignWritten"/>).</summary>
    public bool CurrentMismatchSigned { get; init; }
    /// <summary>3 wires in a bridge: the sensor arm's lead is R_L·(1 + mismatch) against the adjacent arm's R_L.</summary>
    public double LeadMismatch { get; init; }
    /// <summary>Written with a sign: taken at that sign; without one the mismatch is a bound (<see cref="SignWritten"/>).</summary>
    public bool LeadMismatchSigned { get; init; }

    /// <summary>One wire's resistance at <paramref name="celsius"/>: R_L·(1 + α·(T − 25 °C)).</summary>
    public double LeadOhmsAt(double celsius) => LeadOhms * (1 + LeadTempcoPerKelvin * (celsius - 25));
}
