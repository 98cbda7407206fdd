using System.CommandLine;

namespace LongRecord.Cli;

/// <summary>
/// System.CommandLine hands an unknown <c>--option</c> to a file argument that takes many values; this turns such a
/// token into a usage error instead of a "file not found".
/// </summary>
public static class OptionLikeTokens
{
    public static Argument<T> RejectUnknownOptions<T>(this Argument<T> argument)
    {
        argument.Validators.Add(result =>
        {
            foreach (var token in result.Tokens)
            {
                if (token.Value.StartsWith('-') && token.Value.Length > 1 && !File.Exists(token.Value))
                {
                    result.AddError($"unknown option '{token.Value}'");
                }
            }
        });
        return argument;
    }
}
