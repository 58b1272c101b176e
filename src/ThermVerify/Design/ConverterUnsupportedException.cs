namespace ThermVerify.Design;

/// <summary>
/// An analysis was asked of a converter it does not model (a delta-sigma converter given to an analysis built on a
/// successive-approximation converter's acquisition window). Refused rather than treated as the other kind: the
/// message names the analysis, the converter and what to run instead. Bad input (exit code 2).
/// </summary>
public sealed class ConverterUnsupportedException(string message) : Exception(message);

/// <summary>The guard every analysis built on a successive-approximation converter calls first.</summary>
internal static class ConverterSupport
{
    /// <summary>Refuses a delta-sigma design for an analysis that models only a successive-approximation converter.</summary>
    public static void RequireSuccessiveApproximation(FrontEndDesign design, string analysis)
    {
        if (design.Adc.Kind == ConverterKind.SuccessiveApproximation) return;
        throw new ConverterUnsupportedException(
            $"{design.Name}: {analysis} models a successive-approximation converter (one acquisition window per conversion) and does not yet handle " +
            $"the delta-sigma converter of [adc] kind = \"delta-sigma\"; it is refused rather than treated as the other kind. " +
            "Run `thermverify check` on this design (it checks a delta-sigma converter's input loading, settling after a channel switch, " +
            "mains rejection and noise), or describe a successive-approximation converter.");
    }
}
