namespace ThermVerify.Firmware;

/// <summary>
/// The ADC codes a table covers, both ends included. <see cref="TemperatureRisesWithCode"/> is false for an NTC on
/// the low side (and a platinum RTD on the high side), where the voltage falls as the temperature rises.
/// </summary>
public sealed record CodeSpan(int FirstCode, int LastCode, bool TemperatureRisesWithCode)
{
    public int Count => LastCode - FirstCode + 1;

    public bool Contains(int code) => code >= FirstCode && code <= LastCode;
}
