using ThermVerify.FrontEnd.DeltaSigma;

namespace ThermVerify.Check.DeltaSigma;

/// <summary>
/// What a check found of a delta-sigma converter beside the points: its filter (order, decimation, rates, noise
/// bandwidth, readings to settle), the input's load at the report temperatures (switched run, average, closed form),
/// the readings after a channel switch at the temperature where the first reading used is worst, and the rejection of
/// the listed interference frequencies.
/// </summary>
public sealed record DeltaSigmaReport(
    string Filter,
    int Decimation,
    double ModulatorRateHertz,
    double DataRateHertz,
    double NoiseBandwidthHertz,
    int FilterSettlingReadings,
    IReadOnlyList<InputLoad> InputLoading,
    ChannelSettlingResult ChannelSwitch,
    IReadOnlyList<RejectionAt> Rejection,
    double RejectionCelsius);
