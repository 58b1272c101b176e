using System.Text.RegularExpressions;

namespace ThermVerify.Firmware;

/// <summary>Everything a C header carries: the design's name, a C identifier prefix, the model, the table and its checks.</summary>
/// <param name="Prefix">Lower-case C identifier prefix for functions and arrays; macros use it upper-cased.</param>
/// <param name="Coefficients">Optional computed forms, written as macros for firmware that calculates instead.</param>
public sealed partial record FirmwareHeaderContent(
    string DesignName,
    string Prefix,
    FirmwareModel Model,
    FirmwareTable Table,
    TableError Error,
    FaultThresholds Faults,
    ComputedCoefficients? Coefficients = null)
{
    public FirmwareHeaderContent Validated()
    {
        if (Prefix is null || !IdentifierPattern().IsMatch(Prefix))
            throw new FirmwareInputException(
                $"The C prefix '{Prefix}' is not usable: start with a lower-case letter, then lower-case letters, digits or '_' (at most 31 characters), e.g. 'board_ntc'.");
        if (string.IsNullOrWhiteSpace(DesignName) || DesignName.Contains("*/", StringComparison.Ordinal) || DesignName.Any(char.IsControl))
            throw new FirmwareInputException($"The design name '{DesignName}' cannot go into a C comment: give a one-line name without '*/'.");
        return this;
    }

    [GeneratedRegex("^[a-z][a-z0-9_]{0,30}$")]
    private static partial Regex IdentifierPattern();
}
