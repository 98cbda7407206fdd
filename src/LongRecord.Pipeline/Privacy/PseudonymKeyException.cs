namespace LongRecord.Pipeline.Privacy;

/// <summary>A key file that cannot be used.</summary>
public sealed class PseudonymKeyException(string message) : Exception(message);
