namespace ThermVerify.Limits;

/// <summary>Steps of a long run done so far out of the total (units, candidates, sampling runs, remedy searches).</summary>
public readonly record struct RunProgress(int Done, int Total);
