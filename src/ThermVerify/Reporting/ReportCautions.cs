namespace ThermVerify.Reporting;

/// <summary>The limits every report states (the same as docs/cautions.md), as heading and text pairs.</summary>
internal static class ReportCautions
{
    public static readonly IReadOnlyList<(string Heading, string Text)> All =
    [
        ("Simulation does not replace measurement.",
            "The engine solves the circuit described, with the part values given. Real boards add layout leakage, contamination " +
            "and humidity, converter non-idealities beyond the parameters given, interference, thermal gradients, the sensor's " +
            "time constant and self-heating in its real mounting. Verify every design on hardware across its temperature range."),
        ("Models have ranges.",
            "Sensor models are valid only over the range their parameters were fitted or specified for; op-amp macro-models " +
            "capture the parameters listed in the design file and nothing else."),
        ("Safety functions need independent protection.",
            "A reading that drives a heater, charger, motor or cut-out must not be the only thing between a fault and harm. " +
            "Use independent protection and follow the standards, local codes and licensed practice that apply. " +
            "A pass verdict is not a safety certification."),
        ("Figures are honest, not guaranteed.",
            "A pass means the simulated and closed-form errors stayed within the budget set, for the conditions given " +
            "(methods: docs/methods.md)."),
    ];
}
