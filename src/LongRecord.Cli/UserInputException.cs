namespace LongRecord.Cli;

/// <summary>
/// An anticipated problem with what the user asked for (a missing file, a bad option value). Printed as one
/// line without a stack trace; exits with <see cref="ExitCode.BadInput"/>.
/// </summary>
public sealed class UserInputException(string message) : Exception(message);
